export { ticketsRouter } from './tickets.routes';
export { registerTicketHandlers } from './tickets.socket';
