import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { OutboxMessage } from './outbox-message.entity';

/**
 * GET /api/dev/outbox: what the fake SMTP server received, newest first. Mounted only when
 * FAKE_SMTP is on, and open without sign-in so an invitee can follow their link in development.
 */
export function outboxRouter(dataSource: DataSource): Router {
  const router = Router();
  router.get('/outbox', async (_req, res) => {
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
