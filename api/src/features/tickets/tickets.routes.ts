import { Router } from 'express';
import type { AppContext } from '../../context';
import {
  idParamsSchema,
  messageCreateSchema,
  messageListQuerySchema,
  messageMarkSchema,
  messageParamsSchema,
  ticketCreateSchema,
  ticketListQuerySchema,
  ticketUpdateSchema,
  writeUpCreateSchema,
} from '../../../../shared/src/index';
import { signedIn } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';
import { ticketAttachmentsRouter } from '../attachments/attachments.routes';
import { ticketReadingsRouter } from '../readings/index';
import { markPartOfAnswer } from './answer-marks.service';
import { listMessages, postMessage } from './messages.service';
import { listWriteUps, writeUpTicket } from './write-up.service';
import { claimTicket, createTicket, getTicket, listTickets, updateTicket } from './tickets.service';

const ticketId = (res: { locals: Record<string, unknown> }) => parsed(res, 'params', idParamsSchema).id;

export function ticketsRouter(ctx: AppContext): Router {
  const router = Router();
  const byId = validate('params', idParamsSchema);

  /** POST /api/tickets — contractor: open a ticket for my account. */
  router.post('/', validate('body', ticketCreateSchema), async (req, res) => {
    const ticket = await createTicket(ctx, signedIn(req), parsed(res, 'body', ticketCreateSchema));
    res.status(201).json({ ticket });
  });

  /** GET /api/tickets — contractor: my account's; staff: my branches' and mine; admin: all. */
  router.get('/', validate('query', ticketListQuerySchema), async (req, res) => {
    res.json(await listTickets(ctx, signedIn(req), parsed(res, 'query', ticketListQuerySchema)));
  });

  /** GET /api/tickets/:id — whoever may see it (others: 404). */
  router.get('/:id', byId, async (req, res) => {
    res.json({ ticket: await getTicket(ctx, req.user, ticketId(res)) });
  });

  /** PATCH /api/tickets/:id — staff: status, assignee, branch, urgency; contractor: resolve or reopen. */
  router.patch('/:id', byId, validate('body', ticketUpdateSchema), async (req, res) => {
    const input = parsed(res, 'body', ticketUpdateSchema);
    res.json({ ticket: await updateTicket(ctx, signedIn(req), ticketId(res), input) });
  });

  /** POST /api/tickets/:id/claim — staff: assign it to me. */
  router.post('/:id/claim', byId, async (req, res) => {
    res.json({ ticket: await claimTicket(ctx, signedIn(req), ticketId(res)) });
  });

  /** GET /api/tickets/:id/messages?after=&limit= — whoever may see it; notes for staff only. */
  router.get('/:id/messages', byId, validate('query', messageListQuerySchema), async (req, res) => {
    const q = parsed(res, 'query', messageListQuerySchema);
    res.json({ items: await listMessages(ctx, req.user, ticketId(res), q) });
  });

  /** POST /api/tickets/:id/messages — whoever may see it; the same clientId twice stores one message. */
  router.post('/:id/messages', byId, validate('body', messageCreateSchema), async (req, res) => {
    const input = parsed(res, 'body', messageCreateSchema);
    res.status(201).json({ message: await postMessage(ctx, signedIn(req), ticketId(res), input) });
  });

  /** PATCH /api/tickets/:id/messages/:messageId {partOfAnswer} — staff on the ticket: mark it as part of the answer. */
  router.patch(
    '/:id/messages/:messageId',
    validate('params', messageParamsSchema),
    validate('body', messageMarkSchema),
    async (req, res) => {
      const { id, messageId } = parsed(res, 'params', messageParamsSchema);
      const { partOfAnswer } = parsed(res, 'body', messageMarkSchema);
      res.json({ message: await markPartOfAnswer(ctx, signedIn(req), id, messageId, partOfAnswer) });
    },
  );

  /** POST /api/tickets/:id/write-up {messageIds, attachmentIds, keepSerial?} — staff, resolved tickets: a draft article in review. */
  router.post('/:id/write-up', byId, validate('body', writeUpCreateSchema), async (req, res) => {
    const input = parsed(res, 'body', writeUpCreateSchema);
    res.status(201).json(await writeUpTicket(ctx, signedIn(req), ticketId(res), input));
  });

  /** GET /api/tickets/:id/write-ups — whoever may see the ticket: the articles it became that they may read. */
  router.get('/:id/write-ups', byId, async (req, res) => {
    res.json({ items: await listWriteUps(ctx, signedIn(req), ticketId(res)) });
  });

  router.use('/:id/attachments', ticketAttachmentsRouter(ctx));
  router.use('/:id/readings', ticketReadingsRouter(ctx));
  return router;
}
