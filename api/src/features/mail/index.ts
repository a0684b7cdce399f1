// E-mail: the look (renderMail), the queue (queueMail), the notifications sent on ticket and
// account events, and the routes for mail preferences and unsubscribing.
export { renderMail, appUrl, type MailContent, type MailItem } from './mail.layout';
export {
  queueMail,
  mailQueueSettings,
  registerMailWorker,
  MAIL_QUEUE,
  type OutgoingMail,
} from './mail.queue';
export { unsubscribeLinks, unsubscribeToken, readUnsubscribeToken } from './mail.tokens';
export {
  notifyEmailChanged,
  notifyResolved,
  notifyTicketReceived,
  scheduleRepliesMail,
  sendRepliesMail,
  REPLIES_QUEUE,
} from './notifications';
export { mailPreferencesRouter, unsubscribeRouter } from './mail.routes';
