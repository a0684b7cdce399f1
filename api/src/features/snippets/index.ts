export { snippetsRouter } from './snippets.routes';
