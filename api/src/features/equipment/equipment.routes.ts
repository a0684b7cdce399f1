import { Router } from 'express';
import type { AppContext } from '../../context';
import { equipmentQuerySchema } from '../../../../shared/src/index';
import { authorize } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';
import { searchModels } from './equipment.repository';

export function equipmentRouter(ctx: AppContext): Router {
  const router = Router();
  /** GET /api/equipment?q= — signed in: the catalogue, by model number (dashes optional) or family. */
  router.get('/', validate('query', equipmentQuerySchema), async (req, res) => {
    authorize(req.user, 'equipment.search');
    const { q, limit } = parsed(res, 'query', equipmentQuerySchema);
    res.json({ items: await searchModels(ctx.db, q, limit) });
  });
  return router;
}
