export { homeRouter } from './home.routes';
