export { invitationsRouter } from './invitations.routes';
