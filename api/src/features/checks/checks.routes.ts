import { Router } from 'express';
import type { AppContext } from '../../context';
import { gasPressureInputSchema, PURE_CHECKS } from '../../../../shared/src/calc/index';
import { authorize } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';
import { runGasPressure } from './checks.service';

export function checksRouter(ctx: AppContext): Router {
  const router = Router();

  /** POST /api/checks/gas-pressure — signed in: readings against the unit's or an article's spec. */
  router.post('/gas-pressure', validate('body', gasPressureInputSchema), async (req, res) => {
    authorize(req.user, 'check.run');
    res.json({ result: await runGasPressure(ctx, req.user!, parsed(res, 'body', gasPressureInputSchema)) });
  });

  /** POST /api/checks/<kind> — signed in: one of the trade's calculations (see shared/src/calc). */
  for (const [kind, check] of Object.entries(PURE_CHECKS)) {
    router.post(`/${kind}`, validate('body', check.schema), (req, res) => {
      authorize(req.user, 'check.run');
      res.json({ result: (check.run as (input: unknown) => object)(res.locals.body) });
    });
  }

  return router;
}
