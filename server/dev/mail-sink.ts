import { SMTPServer } from 'smtp-server';
import type { Orm } from '@/server/db/orm';
import { DevOutboxMessage } from '@/server/modules/mail/outbox-message.entity';

export interface MailSink {
  host: string;
  port: number;
  close(): Promise<void>;
}

/**
 * The development and test mail sink: an SMTP server on 127.0.0.1 (a free port) that accepts
 * every message and keeps it, raw, in the dev_outbox_message table. Never started in production.
 */
export async function startMailSink(orm: Orm, options: { keepProcessAlive?: boolean } = {}): Promise<MailSink> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Sphereline development mail sink',
    size: 2 * 1024 * 1024,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        // An SMTP delivery, not an HTTP request: no request context here.
        const em = orm.em.fork();
        const mailFrom = session.envelope.mailFrom;
        em.create(DevOutboxMessage, {
          mailFrom: mailFrom ? mailFrom.address : null,
          recipients: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
          raw: Buffer.concat(chunks).toString('utf8'),
        });
        em.flush().then(
          () => callback(),
          (error: Error) => callback(error),
        );
      });
    },
  });
  const port: number = await new Promise((resolve, reject) => {
    server.server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.server.address();
      resolve(typeof address === 'object' && address ? address.port : 0);
    });
  });
  // In tests the sink must not keep jest's process alive after the last test.
  if (!options.keepProcessAlive) server.server.unref();
  return {
    host: '127.0.0.1',
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
