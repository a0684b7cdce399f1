import { Router } from 'express';
import { asc, eq, ilike, or, sql } from 'drizzle-orm';
import type { AppContext } from '../../context';
import { equipmentModels } from '../../db/schema/index';
import { equipmentQuerySchema } from '../../../../shared/src/index';
import { likePattern } from '../../lib/pagination';
import { authorize } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';

export function equipmentRouter(ctx: AppContext): Router {
  const router = Router();
  /** GET /api/equipment?q= — signed in: the catalogue, by model number (dashes optional) or family. */
  router.get('/', validate('query', equipmentQuerySchema), async (req, res) => {
    authorize(req.user, 'equipment.search');
    const { q, limit } = parsed(res, 'query', equipmentQuerySchema);
    const squashed = q?.replace(/[^a-z0-9]/gi, '') ?? '';
    const where = q
      ? or(
          ilike(equipmentModels.modelNumber, likePattern(q)),
          ilike(equipmentModels.family, likePattern(q)),
          ilike(equipmentModels.brand, likePattern(q)),
          squashed
            ? sql`regexp_replace(${equipmentModels.modelNumber}, '[^A-Za-z0-9]', '', 'g') ilike ${likePattern(squashed)}`
            : undefined,
        )
      : undefined;
    const items = await ctx.db
      .select({
        id: equipmentModels.id,
        brand: equipmentModels.brand,
        modelNumber: equipmentModels.modelNumber,
        family: equipmentModels.family,
        type: equipmentModels.type,
        fuels: equipmentModels.fuels,
      })
      .from(equipmentModels)
      .where(where ? sql`${where} and ${eq(equipmentModels.active, true)}` : eq(equipmentModels.active, true))
      .orderBy(asc(equipmentModels.brand), asc(equipmentModels.modelNumber))
      .limit(limit);
    res.json({ items });
  });
  return router;
}
