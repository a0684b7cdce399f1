export { checksRouter } from './checks.routes';
