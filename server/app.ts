import express, { type Express } from 'express';
import helmet from 'helmet';
import type { ChangeFeed } from './db/change-feed';
import type { Orm } from './db/orm';
import { requestContext } from './db/request-context';
import { developmentTools } from './development-tools';
import { readEnv, type Env } from './env';
import { attachAccounts, originCheck } from './http/auth-middleware';
import { apiNotFound, errorHandler } from './http/error-handler';
import { requestLog } from './http/request-log';
import { hostAllowList } from './http/host-allow-list';
import { rejectUnstorableText } from './http/unstorable-text';
import { serveWebApp } from './web/serve-web-app';
import { defaultAuthSettings, type AccountsContext, type AuthSettings } from './modules/auth/auth-context';
import { authRoutes } from './modules/auth/auth.routes';
import { createLucia } from './modules/auth/lucia';
import { chemRoutes } from './modules/chem/chem.routes';
import { groupRoutes } from './modules/groups/groups.routes';
import { healthRoutes } from './modules/health/health.routes';
import { libraryRoutes } from './modules/library/library.routes';
import { createMailer, type Mailer } from './modules/mail/mailer';
import { attachmentRoutes } from './modules/attachments/attachment.routes';
import { lazyStorage, type ObjectStorage } from './modules/attachments/object-storage';
import { exchangeRoutes } from './modules/exchange/exchange.routes';
import { onLibraryEvents } from './modules/library/library-events';
import { metadataClientFor, type MetadataClient } from './modules/metadata/metadata-setup';
import { metadataRoutes } from './modules/metadata/metadata.routes';
import { preferencesRoutes } from './modules/notifications/preferences.routes';
import { createReviewMail, type ReviewMail } from './modules/notifications/review-mail';

export interface AppOptions {
  orm: Orm;
  /** Folder of the exported web app; when missing, client routes explain how to build it. */
  webDir?: string;
  logRequests?: boolean;
  /** Outgoing mail; by default SMTP_URL, else (not in production) the local sink of server/dev, started on first use. */
  mailer?: Mailer;
  /** Throttle limits and token lifetimes (tests tighten them). */
  auth?: Partial<AuthSettings>;
  /** Overrides for values otherwise read from the environment (APP_URL, NODE_ENV). */
  env?: Partial<Pick<Env, 'appUrl' | 'NODE_ENV' | 'TRUST_PROXY'>>;
  /**
   * Change notifications for the in-memory caches (session lookups, library searches); without one
   * nothing is cached. The caller starts and stops it (server/index.ts).
   */
  changeFeed?: ChangeFeed;
  /** DOI look-up; by default METADATA_URL, else (not in production) the local fake of server/dev, started on first use. */
  metadata?: MetadataClient;
  /** Attachment store; by default S3_* settings, else (not in production) the local fake S3 of server/dev, started on first use. */
  storage?: ObjectStorage;
  /** Receives the review-mail notifier (tests wait on its settle()). */
  onReviewMail?: (reviewMail: ReviewMail) => void;
}

/** The whole HTTP app without listen(), so tests drive it with supertest. */
/** Express's "trust proxy" from TRUST_PROXY: off when unset, a hop count when a number, else as written. */
export function trustProxySetting(value: string | undefined): boolean | number | string {
  const text = value?.trim() ?? '';
  if (text === '' || text === 'false' || text === '0') return false;
  if (/^\d+$/.test(text)) return Number(text);
  return text;
}

export function createApp({ orm, webDir, logRequests = false, ...options }: AppOptions): Express {
  const env = { ...readEnv(), ...options.env };
  const accounts: AccountsContext = {
    orm,
    lucia: createLucia(orm, options.changeFeed),
    mailer:
      options.mailer ?? createMailer({ orm, smtpUrl: env.SMTP_URL, nodeEnv: env.NODE_ENV, from: env.MAIL_FROM }),
    appUrl: env.appUrl,
    settings: { ...defaultAuthSettings, ...options.auth },
  };
  const metadata = options.metadata ? async () => options.metadata as MetadataClient : metadataClientFor(env);
  const storage =
    options.storage ??
    lazyStorage(
      env.S3_ENDPOINT && env.S3_ACCESS_KEY && env.S3_SECRET_KEY
        ? { endpoint: env.S3_ENDPOINT, bucket: env.S3_BUCKET, accessKeyId: env.S3_ACCESS_KEY, secretAccessKey: env.S3_SECRET_KEY, region: env.S3_REGION }
        : null,
      env.NODE_ENV,
      env.dataDirAbsolute,
      {
        bucket: env.S3_BUCKET,
        credentials: env.S3_ACCESS_KEY && env.S3_SECRET_KEY ? { accessKeyId: env.S3_ACCESS_KEY, secretAccessKey: env.S3_SECRET_KEY } : undefined,
      },
    );
  const reviewMail = createReviewMail(orm, accounts.mailer, accounts.appUrl);
  onLibraryEvents(orm.em, reviewMail.handle);
  options.onReviewMail?.(reviewMail);
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', trustProxySetting(env.TRUST_PROXY));
  app.use(hostAllowList(env.appUrl, env.ALLOWED_HOSTS));
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          // react-native-web writes its styles into <style> tags at run time.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );

  const api = express.Router();
  if (logRequests) api.use(requestLog());
  // One entity manager per request (MikroORM's RequestContext), before anything that reads the database.
  api.use(requestContext(orm));
  api.use(originCheck(accounts.appUrl));
  api.use(attachAccounts(accounts));
  api.use(express.json({ limit: '1mb', strict: true }));
  api.use(rejectUnstorableText);
  api.use(healthRoutes(orm));
  api.use(chemRoutes());
  api.use(authRoutes(accounts));
  api.use(groupRoutes(accounts));
  api.use(preferencesRoutes());
  api.use(metadataRoutes(metadata));
  api.use(exchangeRoutes(orm));
  api.use(attachmentRoutes(storage));
  api.use(libraryRoutes(orm, options.changeFeed));
  // The outbox exists only where the development tools are loaded, never in production.
  const dev = developmentTools(env.NODE_ENV);
  if (dev) api.use(dev.outboxRoutes());
  api.use(apiNotFound);
  app.use('/api', api);

  if (webDir) serveWebApp(app, webDir);
  app.use(errorHandler);
  return app;
}
