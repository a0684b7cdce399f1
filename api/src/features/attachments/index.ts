export { attachmentsRouter } from './attachments.routes';
