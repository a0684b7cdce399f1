import { Router, type RequestHandler } from 'express';
import type { AppContext } from '../../context';
import {
  accountCreateSchema,
  accountUpdateSchema,
  branchCreateSchema,
  branchUpdateSchema,
  idParamsSchema,
  listQuerySchema,
  userCreateSchema,
  userListQuerySchema,
  userUpdateSchema,
} from '../../../../shared/src/index';
import { authorize, type Action } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';
import * as admin from './admin.service';

const allow =
  (action: Action): RequestHandler =>
  (req, _res, next) => {
    authorize(req.user, action);
    next();
  };

const id = (res: { locals: Record<string, unknown> }) => parsed(res, 'params', idParamsSchema).id;

export function adminRouter(ctx: AppContext): Router {
  const router = Router();

  router.use('/users', allow('admin.users.manage'));
  /** GET /api/admin/users — admin: people, paginated, searchable by name, e-mail or company. */
  router.get('/users', validate('query', userListQuerySchema), async (req, res) => {
    res.json(await admin.listUsers(ctx.db, parsed(res, 'query', userListQuerySchema)));
  });
  /** POST /api/admin/users — admin: create a staff or contractor user. */
  router.post('/users', validate('body', userCreateSchema), async (req, res) => {
    res
      .status(201)
      .json({ user: await admin.createUser(ctx, req.user!, parsed(res, 'body', userCreateSchema)) });
  });
  /** PATCH /api/admin/users/:id — admin: change details or role, deactivate (sessions end at once). */
  router.patch(
    '/users/:id',
    validate('params', idParamsSchema),
    validate('body', userUpdateSchema),
    async (req, res) => {
      res.json({
        user: await admin.updateUser(ctx, req.user!, id(res), parsed(res, 'body', userUpdateSchema)),
      });
    },
  );

  router.use('/accounts', allow('admin.accounts.manage'));
  /** GET /api/admin/accounts — admin: contractor accounts, paginated. */
  router.get('/accounts', validate('query', listQuerySchema), async (_req, res) => {
    res.json(await admin.listAccounts(ctx.db, parsed(res, 'query', listQuerySchema)));
  });
  /** POST /api/admin/accounts — admin: open a contractor account. */
  router.post('/accounts', validate('body', accountCreateSchema), async (req, res) => {
    res
      .status(201)
      .json({ account: await admin.createAccount(ctx, req.user!, parsed(res, 'body', accountCreateSchema)) });
  });
  /** PATCH /api/admin/accounts/:id — admin: edit or close an account. */
  router.patch(
    '/accounts/:id',
    validate('params', idParamsSchema),
    validate('body', accountUpdateSchema),
    async (req, res) => {
      res.json({
        account: await admin.updateAccount(ctx, req.user!, id(res), parsed(res, 'body', accountUpdateSchema)),
      });
    },
  );

  router.use('/branches', allow('admin.branches.manage'));
  /** GET /api/admin/branches — admin: branches, paginated. */
  router.get('/branches', validate('query', listQuerySchema), async (_req, res) => {
    res.json(await admin.listBranches(ctx.db, parsed(res, 'query', listQuerySchema)));
  });
  /** POST /api/admin/branches — admin: add a branch. */
  router.post('/branches', validate('body', branchCreateSchema), async (req, res) => {
    res
      .status(201)
      .json({ branch: await admin.createBranch(ctx, req.user!, parsed(res, 'body', branchCreateSchema)) });
  });
  /** PATCH /api/admin/branches/:id — admin: rename, change the desk address, close. */
  router.patch(
    '/branches/:id',
    validate('params', idParamsSchema),
    validate('body', branchUpdateSchema),
    async (req, res) => {
      res.json({
        branch: await admin.updateBranch(ctx, req.user!, id(res), parsed(res, 'body', branchUpdateSchema)),
      });
    },
  );

  return router;
}
