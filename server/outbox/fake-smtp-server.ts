import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import type { Logger } from 'pino';
import { SMTPServer } from 'smtp-server';
import type { DataSource } from 'typeorm';
import { OutboxMessage } from './outbox-message.entity';

export interface FakeSmtpServer {
  port: number;
  close(): Promise<void>;
}

const MAX_MESSAGE_bytes = 10 * 1024 * 1024;

/**
 * A real SMTP server on loopback that keeps every message in outbox_message instead of
 * delivering it. The message is stored before the server answers 250, so when the sender's
 * sendMail resolves the message is already in the outbox.
 */
export async function startFakeSmtpServer(options: { dataSource: DataSource; port: number; logger: Logger }): Promise<FakeSmtpServer> {
  const repository = options.dataSource.getRepository(OutboxMessage);
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    disableReverseLookup: true,
    size: MAX_MESSAGE_bytes,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) =>
          repository.insert({
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address).join(', '),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : '',
            receivedAt: new Date(),
          }),
        )
        .then(
          () => callback(),
          (error: unknown) => {
            options.logger.error({ err: error }, 'fake SMTP server could not store a message');
            callback(new Error('message could not be stored'));
          },
        );
    },
  });
  server.on('error', (error) => options.logger.error({ err: error }, 'fake SMTP server error'));

  await new Promise<void>((resolve, reject) => {
    const onError = (error: Error) => reject(error);
    server.server.once('error', onError);
    server.listen(options.port, '127.0.0.1', () => {
      server.server.off('error', onError);
      resolve();
    });
  });
  const { port } = server.server.address() as AddressInfo;
  return {
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
