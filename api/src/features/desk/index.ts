export { deskRouter } from './desk.routes';
