import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Orm } from './db/orm';
import { apiNotFound, errorHandler } from './http/error-handler';
import { requestLog } from './http/request-log';
import { chemRoutes } from './modules/chem/chem.routes';
import { healthRoutes } from './modules/health/health.routes';

export interface AppOptions {
  orm: Orm;
  /** Folder of the exported web app; when missing, client routes explain how to build it. */
  webDir?: string;
  logRequests?: boolean;
}

/** The whole HTTP app without listen(), so tests drive it with supertest. */
export function createApp({ orm, webDir, logRequests = false }: AppOptions): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
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
  api.use(express.json({ limit: '1mb', strict: true }));
  api.use(healthRoutes(orm));
  api.use(chemRoutes());
  api.use(apiNotFound);
  app.use('/api', api);

  if (webDir) serveWebApp(app, webDir);
  app.use(errorHandler);
  return app;
}

function serveWebApp(app: Express, webDir: string) {
  app.use(express.static(webDir, { index: false, maxAge: '1h' }));
  const indexFile = path.join(webDir, 'index.html');
  // Client routes (/check, /library/…): the app's HTML, which routes in the browser.
  app.use((req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    if (!fs.existsSync(indexFile)) {
      res
        .status(503)
        .type('text/plain')
        .send('The web app has not been built yet: run `npm run build:web` (npm start does it for you).');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexFile);
  });
}
