import { Router } from 'express';
import type { AppContext } from '../../context';
import type { HomeResponse } from '../../../../shared/src/index';
import { AppError } from '../../lib/errors';
import { authorize } from '../../lib/policies';
import { findAccountHome, findBranches } from './home.repository';

export function homeRouter(ctx: AppContext): Router {
  const router = Router();

  /** GET /api/home — signed in: my company (contractors) or my branches (staff). */
  router.get('/', async (req, res) => {
    authorize(req.user, 'home.view');
    const user = req.user;
    let body: HomeResponse;
    if (user.role === 'contractor') {
      authorize(user, 'account.view', { accountId: user.accountId }, 'not-found');
      const account = await findAccountHome(ctx.db, user.accountId!);
      if (!account) throw AppError.notFound('Your account');
      body = { account, branches: [account.homeBranch] };
    } else {
      body = {
        account: null,
        branches: await findBranches(ctx.db, user.role === 'admin' ? 'all' : user.branchIds),
      };
    }
    res.json(body);
  });

  return router;
}
