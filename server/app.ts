import path from 'node:path';
import fs from 'node:fs';
import express from 'express';
import helmet from 'helmet';
import cookieParser from 'cookie-parser';
import { pinoHttp } from 'pino-http';
import pino from 'pino';
import type { Sequelize } from 'sequelize';
import type PgBoss from 'pg-boss';
import { env, trustProxyValue } from './env';
import { crossSiteGuard } from './lib/cross-site';
import { errorHandler, routeNotFound } from './lib/errors';
import { apiRouter } from './routes';

export interface AppDeps {
  sequelize: Sequelize;
  /** The job queue; without it (some tests) mail is not queued. */
  boss?: PgBoss;
  signInLimitPerEmail?: number;
  signInLimitPerIp?: number;
  /** Seconds each try waits once an account has too many wrong passwords (default 30). */
  signInDelaySeconds?: number;
  signInLockAfter?: number;
  /** Serve the exported web app from this folder when it exists. */
  distDir?: string;
  logLevel?: string;
}

export function createApp(deps: AppDeps) {
  const app = express();
  app.locals.deps = deps;
  app.disable('x-powered-by');
  app.set('trust proxy', trustProxyValue(env.TRUST_PROXY));
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // react-native-web writes its styles into <style> tags at run time.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'script-src': ["'self'"],
          // Served over plain HTTP on a LAN or localhost: never rewrite requests to https.
          'upgrade-insecure-requests': null,
        },
      },
      strictTransportSecurity: env.PUBLIC_URL.startsWith('https:'),
    }),
  );
  const logger = pino({ level: deps.logLevel ?? env.LOG_LEVEL });
  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
      // One short line per request; never headers (they carry the session cookie).
      serializers: {
        req: (req: { method: string; url: string }) => ({ method: req.method, url: req.url }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
    }),
  );
  app.use(cookieParser());
  if (env.DEV_WEB_ORIGIN) app.use(devCors(env.DEV_WEB_ORIGIN));
  app.use('/api', crossSiteGuard({ publicUrl: env.PUBLIC_URL, devWebOrigin: env.DEV_WEB_ORIGIN }), express.json({ limit: '200kb' }), apiRouter(deps), routeNotFound);

  if (deps.distDir && fs.existsSync(path.join(deps.distDir, 'index.html'))) serveWebApp(app, deps.distDir);

  app.use(errorHandler);
  return app;
}

// Only for `npm run dev`, where Expo's dev server (another port) calls this API with the cookie.
function devCors(origin: string): express.RequestHandler {
  return (req, res, next) => {
    if (req.get('origin') !== origin) return next();
    res.setHeader('Access-Control-Allow-Origin', origin);
    res.setHeader('Access-Control-Allow-Credentials', 'true');
    res.setHeader('Access-Control-Allow-Headers', 'Content-Type, Authorization, Idempotency-Key, If-Match');
    res.setHeader('Access-Control-Allow-Methods', 'GET, POST, PUT, PATCH, DELETE, OPTIONS');
    if (req.method === 'OPTIONS') return void res.status(204).end();
    next();
  };
}

function serveWebApp(app: express.Express, dist: string) {
  app.use(
    express.static(dist, {
      index: false,
      setHeaders(res, filePath) {
        if (filePath.includes(`${path.sep}_expo${path.sep}`) || filePath.includes(`${path.sep}assets${path.sep}`)) {
          res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        }
      },
    }),
  );
  // SPA fallback; a file-like path that was not found stays a 404.
  app.get('/{*splat}', (req, res, next) => {
    if (path.extname(req.path)) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(path.resolve(dist, 'index.html'));
  });
}
