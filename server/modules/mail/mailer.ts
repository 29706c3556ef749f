import nodemailer, { type Transporter } from 'nodemailer';
import type { Orm } from '@/server/db/orm';
import { AppError } from '@/server/http/errors';
import { developmentTools } from '@/server/development-tools';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  /** Starts the transport (and the local sink when there is one); says where mail goes. */
  start(): Promise<string>;
  close(): Promise<void>;
}

export interface MailerOptions {
  orm: Orm;
  smtpUrl?: string;
  nodeEnv: 'development' | 'production' | 'test';
  from: string;
  /** Keep the sink's port open even when nothing else runs (the `npm start` server). */
  keepProcessAlive?: boolean;
}

/**
 * E-mail through nodemailer. With SMTP_URL: that server. Without it, in development and tests:
 * the local SMTP sink of server/dev, started on first use (messages land in the dev outbox).
 * Without it in production (or without the development tools): mail cannot be sent, and the
 * request that needed it answers 503.
 */
export function createMailer(options: MailerOptions): Mailer {
  let transport: Transporter | null = null;
  let sink: { host: string; port: number; close(): Promise<void> } | null = null;
  let starting: Promise<string> | null = null;

  const start = (): Promise<string> => {
    starting ??= (async () => {
      if (options.smtpUrl) {
        transport = nodemailer.createTransport(options.smtpUrl);
        return `SMTP server from SMTP_URL (${new URL(options.smtpUrl).host})`;
      }
      const dev = developmentTools(options.nodeEnv);
      if (!dev) return 'nowhere: SMTP_URL is not set';
      sink = await dev.startMailSink(options.orm, { keepProcessAlive: options.keepProcessAlive });
      // PLATFORM trap 14: the sink speaks plain SMTP on loopback, so no STARTTLS.
      transport = nodemailer.createTransport({ host: sink.host, port: sink.port, secure: false, ignoreTLS: true });
      return `local mail sink on ${sink.host}:${sink.port} (read it at /api/dev/outbox)`;
    })();
    return starting;
  };

  return {
    start,
    async send(mail) {
      await start();
      if (!transport) {
        console.error(`[mail] not sent (SMTP_URL is not set): "${mail.subject}" to ${mail.to}`);
        throw new AppError('UNAVAILABLE', 'E-mail cannot be sent right now. Try again later.');
      }
      try {
        await transport.sendMail({ from: options.from, ...mail, textEncoding: 'base64' });
      } catch (error) {
        console.error(`[mail] sending "${mail.subject}" failed:`, (error as Error).message);
        throw new AppError('UNAVAILABLE', 'E-mail cannot be sent right now. Try again later.');
      }
    },
    async close() {
      transport?.close();
      await sink?.close();
    },
  };
}
