import { Router } from 'express';
import { invitationCreateSchema, passwordResetRequestSchema, personTokenParamsSchema, setPasswordWithTokenSchema } from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { currentPerson } from '../auth/current-person';
import { allow, open } from '../auth/guard';
import { validate } from '../http/validate-request';
import { invitePerson } from './invite-person.use-case';
import { describeToken, setPasswordWithToken } from './redeem-token.use-case';
import { requestPasswordReset } from './request-password-reset.use-case';

/**
 * Invitations and password resets by e-mail: an admin invites (POST /api/invitations); the link's
 * page reads GET /api/invitations/:token (or /api/password-resets/:token) and sets the password with
 * POST /api/invitations/accept (or /api/password-resets/confirm); anyone may ask for a reset link
 * (POST /api/password-resets/request).
 */
export function invitationsRouter(ctx: ApiContext): Router {
  const router = Router();
  const publicUrl = ctx.config.http.publicUrl;
  const invite = validate({ body: invitationCreateSchema });
  const tokenParams = validate({ params: personTokenParamsSchema });
  const withToken = validate({ body: setPasswordWithTokenSchema });
  const resetRequest = validate({ body: passwordResetRequestSchema });

  router.post('/api/invitations', allow('admin'), invite, async (_req, res) => {
    res.status(201).json(await invitePerson(ctx.dataSource, invite.from(res).body, currentPerson(res), publicUrl));
  });
  router.get('/api/invitations/:token', open(), tokenParams, async (_req, res) => {
    res.json(await describeToken(ctx.dataSource.manager, tokenParams.from(res).params.token, 'invitation'));
  });
  router.get('/api/password-resets/:token', open(), tokenParams, async (_req, res) => {
    res.json(await describeToken(ctx.dataSource.manager, tokenParams.from(res).params.token, 'password_reset'));
  });
  router.post('/api/invitations/accept', open(), withToken, async (_req, res) => {
    const { token, password } = withToken.from(res).body;
    res.json(await setPasswordWithToken(ctx.dataSource, ctx.lucia, 'invitation', token, password));
  });
  router.post('/api/password-resets/request', open(), resetRequest, async (req, res) => {
    const ip = req.ip ?? req.socket.remoteAddress ?? 'unknown';
    await requestPasswordReset(ctx.dataSource, resetRequest.from(res).body.email, ip, publicUrl);
    res.status(202).json({ message: 'If the address belongs to an active account, a link to choose a new password is on its way.' });
  });
  router.post('/api/password-resets/confirm', open(), withToken, async (_req, res) => {
    const { token, password } = withToken.from(res).body;
    res.json(await setPasswordWithToken(ctx.dataSource, ctx.lucia, 'password_reset', token, password));
  });
  return router;
}
