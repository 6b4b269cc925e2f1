import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { requireAdmin } from '../auth/require-access';
import { OutboxMessage } from './outbox-message.entity';

/**
 * GET /api/dev/outbox: what the fake SMTP server received, newest first. Mounted only where
 * servesDevOutbox holds; site admins only, since the mails carry other users' reset and invitation links.
 */
export function outboxRouter(dataSource: DataSource): Router {
  const router = Router();
  router.get('/outbox', requireAdmin, async (_req, res) => {
    const messages = await dataSource.getRepository(OutboxMessage).find({ order: { receivedAt: 'DESC' }, take: 200 });
    res.json({
      messages: messages.map((m) => ({
        id: m.id,
        from: m.from,
        to: m.to,
        subject: m.subject,
        text: m.text,
        html: m.html,
        receivedAt: m.receivedAt.toISOString(),
      })),
    });
  });
  return router;
}
