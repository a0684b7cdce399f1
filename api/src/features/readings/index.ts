export { ticketReadingsRouter } from './readings.routes';
