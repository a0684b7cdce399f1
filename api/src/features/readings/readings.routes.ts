import { Router } from 'express';
import type { AppContext } from '../../context';
import { idParamsSchema, readingCreateSchema } from '../../../../shared/src/index';
import { signedIn } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';
import { addReading, listReadings } from './readings.service';

export function ticketReadingsRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  const ticketId = (res: { locals: Record<string, unknown> }) => parsed(res, 'params', idParamsSchema).id;

  /** GET /api/tickets/:id/readings — whoever may see the ticket: readings with their verdicts. */
  router.get('/', validate('params', idParamsSchema), async (req, res) => {
    res.json({ items: await listReadings(ctx, signedIn(req), ticketId(res)) });
  });

  /** POST /api/tickets/:id/readings — whoever may see the ticket: store a reading, post its result card. */
  router.post(
    '/',
    validate('params', idParamsSchema),
    validate('body', readingCreateSchema),
    async (req, res) => {
      const reading = await addReading(
        ctx,
        signedIn(req),
        ticketId(res),
        parsed(res, 'body', readingCreateSchema),
      );
      res.status(201).json({ reading });
    },
  );

  return router;
}
