import { Router } from 'express';
import { caughtMailParamsSchema } from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { allow } from '../auth/guard';
import { AppError } from '../http/app-error';
import { validate } from '../http/validate-request';
import { MailCatcherClient } from './mail-catcher-client';

/**
 * GET /api/dev/mail and /api/dev/mail/:id (admin): the local mail catcher's messages, for reading
 * invitations and notices in development (issue 6 item 5). Without MAIL_CATCHER_URL the routes
 * answer 404: there is no catcher in production, and mail goes to real mailboxes.
 */
export function devMailRouter(ctx: ApiContext): Router {
  const router = Router();
  const catcherUrl = ctx.config.mailCatcherUrl;
  const catcher = () => {
    if (!catcherUrl) {
      throw AppError.notFound('Caught mail exists only in development: this server has no local mail catcher (MAIL_CATCHER_URL is not set), so mail goes to real mailboxes.');
    }
    return new MailCatcherClient(catcherUrl);
  };
  const one = validate({ params: caughtMailParamsSchema });

  router.get('/api/dev/mail', allow('admin'), async (_req, res) => {
    res.json(await catcher().list());
  });
  router.get('/api/dev/mail/:id', allow('admin'), one, async (_req, res) => {
    res.json(await catcher().message(one.from(res).params.id));
  });
  return router;
}
