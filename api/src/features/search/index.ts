export { searchRouter } from './search.routes';
