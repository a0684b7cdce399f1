import { Router } from 'express';
import type { AppContext } from '../../context';
import { authorize } from '../../lib/policies';
import { listActiveBranches, listDeskMembers } from './desk.repository';

export function deskRouter(ctx: AppContext): Router {
  const router = Router();

  /** GET /api/desk/branches — staff: the branches a ticket can be transferred to. */
  router.get('/branches', async (req, res) => {
    authorize(req.user, 'desk.view');
    res.json({ items: await listActiveBranches(ctx.db) });
  });

  /** GET /api/desk/members — staff: the people on the desk, to assign a ticket to. */
  router.get('/members', async (req, res) => {
    authorize(req.user, 'desk.view');
    res.json({ items: await listDeskMembers(ctx.db) });
  });

  return router;
}
