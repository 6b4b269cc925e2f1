import { Router } from 'express';
import { z } from 'zod';
import { currentUser, requireSignedIn } from '../auth/require-access';
import type { AppContext } from '../http/app-context';
import { inputOf, validate } from '../http/validate';
import { NotificationPreferences } from './notification-preferences';

const preferencesInput = {
  body: z.strictObject({ assigned: z.boolean(), statusChanged: z.boolean(), mentioned: z.boolean() }),
};

/** /api/notifications: the signed-in user's own e-mail settings. */
export function notificationsRouter(ctx: AppContext): Router {
  const preferences = new NotificationPreferences(ctx.dataSource);
  const router = Router();

  router.get('/preferences', requireSignedIn, async (req, res) => {
    res.json(await preferences.get(currentUser(req).id));
  });

  router.put('/preferences', requireSignedIn, validate(preferencesInput), async (req, res) => {
    res.json(await preferences.set(currentUser(req).id, inputOf(res, preferencesInput).body));
  });

  return router;
}
