import { Router } from 'express';
import type { AppContext } from '../../context';
import {
  idParamsSchema,
  invitationAcceptSchema,
  invitationCreateSchema,
  invitationListQuerySchema,
  tokenBodySchema,
} from '../../../../shared/src/index';
import { signedIn } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';
import { logIn } from '../auth/auth.routes';
import { recordSignIn } from '../auth/auth.service';
import { acceptInvitation, lookUpInvitation } from './invitations.accept';
import { createInvitation, listInvitations, revokeInvitation } from './invitations.service';

// The link's token travels in request bodies, never in a URL, so it stays out of access logs.
// Lookup and acceptance are not rate limited: a token has 256 random bits and cannot be guessed.
export function invitationsRouter(ctx: AppContext): Router {
  const router = Router();

  /** GET /api/invitations — admin: every invitation; account owner: those into their account. */
  router.get('/', validate('query', invitationListQuerySchema), async (req, res) => {
    res.json(await listInvitations(ctx, signedIn(req), parsed(res, 'query', invitationListQuerySchema)));
  });

  /** POST /api/invitations — admin: invite staff; account owner: invite a teammate. */
  router.post('/', validate('body', invitationCreateSchema), async (req, res) => {
    const invitation = await createInvitation(
      ctx,
      signedIn(req),
      parsed(res, 'body', invitationCreateSchema),
    );
    res.status(201).json({ invitation });
  });

  /** POST /api/invitations/:id/revoke — admin, or the owner of the invitation's account. */
  router.post('/:id/revoke', validate('params', idParamsSchema), async (req, res) => {
    const id = parsed(res, 'params', idParamsSchema).id;
    res.json({ invitation: await revokeInvitation(ctx, signedIn(req), id) });
  });

  /** POST /api/invitations/lookup {token} — anyone with the link: who it is for, or why it cannot be used. */
  router.post('/lookup', validate('body', tokenBodySchema), async (_req, res) => {
    res
      .set('Cache-Control', 'no-store')
      .json(await lookUpInvitation(ctx, parsed(res, 'body', tokenBodySchema).token));
  });

  /** POST /api/invitations/accept {token, name, password} — anyone with the link: join and sign in. */
  router.post('/accept', validate('body', invitationAcceptSchema), async (req, res) => {
    const user = await acceptInvitation(ctx, parsed(res, 'body', invitationAcceptSchema));
    await logIn(req, user);
    req.session.signedInAt = Date.now();
    await recordSignIn(ctx.db, user);
    res.status(201).json({ user });
  });

  return router;
}
