import { Router } from 'express';
import type { AppContext } from '../../context';
import {
  equipmentQuerySchema,
  equipmentSpecUpdateSchema,
  idParamsSchema,
} from '../../../../shared/src/index';
import { audit } from '../../lib/audit';
import { AppError } from '../../lib/errors';
import { authorize } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';
import { findModel, searchModels, updateSpec } from './equipment.repository';

export function equipmentRouter(ctx: AppContext): Router {
  const router = Router();
  /** GET /api/equipment?q= — signed in: the catalogue, by model number (dashes optional) or family. */
  router.get('/', validate('query', equipmentQuerySchema), async (req, res) => {
    authorize(req.user, 'equipment.search');
    const { q, limit } = parsed(res, 'query', equipmentQuerySchema);
    res.json({ items: await searchModels(ctx.db, q, limit) });
  });
  /** GET /api/equipment/:id — signed in: one model with its spec table. */
  router.get('/:id', validate('params', idParamsSchema), async (req, res) => {
    authorize(req.user, 'equipment.search');
    const model = await findModel(ctx.db, parsed(res, 'params', idParamsSchema).id);
    if (!model) throw AppError.notFound('Model');
    res.json({ model });
  });

  /** PUT /api/equipment/:id/spec — specialist, admin: replace the model's spec table (validated). */
  router.put(
    '/:id/spec',
    validate('params', idParamsSchema),
    validate('body', equipmentSpecUpdateSchema),
    async (req, res) => {
      authorize(req.user, 'equipment.edit');
      const id = parsed(res, 'params', idParamsSchema).id;
      const { spec } = parsed(res, 'body', equipmentSpecUpdateSchema);
      await ctx.db.transaction(async (tx) => {
        if (!(await updateSpec(tx, id, spec))) throw AppError.notFound('Model');
        await audit(tx, {
          actorId: req.user!.id,
          action: 'equipment.spec-update',
          targetType: 'equipment_model',
          targetId: id,
        });
      });
      res.json({ model: await findModel(ctx.db, id) });
    },
  );

  return router;
}
