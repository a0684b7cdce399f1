export { adminRouter } from './admin.routes';
