import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import session, { type Store } from 'express-session';
import compression from 'compression';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { csrfSync } from 'csrf-sync';
import { env } from './config/env.ts';
import { countInFlight } from './lib/in-flight.ts';
import { logger } from './lib/logger.ts';
import { IMMUTABLE_ASSET, precompressedAssets, webShell } from './lib/web-shell.ts';
import { passport } from './lib/passport.ts';
import { MariaDbSessionStore } from './lib/session-store.ts';
import { requestId } from './middleware/request-id.ts';
import { errorHandler, notFoundApi } from './middleware/error-handler.ts';
import { healthRouter } from './routes/health.routes.ts';
import { authRouter } from './routes/auth.routes.ts';
import { usersRouter } from './routes/users.routes.ts';
import { mailRouter } from './routes/mail.routes.ts';
import {
  combinerBoxesRouter,
  inverterModelsRouter,
  invertersRouter,
  moduleModelsRouter,
  sitesRouter,
  stringsRouter,
} from './routes/assets.routes.ts';
import { checksRouter, instrumentsRouter, stringChecksRouter, ticketChecksRouter } from './routes/field-checks.routes.ts';
import { diodesRouter, photosRouter, ticketDiodesRouter, ticketPhotosRouter } from './routes/evidence.routes.ts';
import { signOffRouter } from './routes/sign-off.routes.ts';
import { fleetRouter } from './routes/fleet.routes.ts';
import { meRouter, slaRouter, techniciansRouter, workOrdersRouter } from './routes/work-orders.routes.ts';

export type AppOptions = {
  /** Serve the built web app from this folder (SPA fallback); omitted or missing → API only. */
  webDist?: string | null;
};

/** Sessions live in MariaDB so that any number of API processes share them (see lib/session-store.ts). */
export function createSessionStore(): Store {
  return new MariaDbSessionStore();
}

/** Builds the Express app; never listens (tests import it). */
export function createApp(options: AppOptions = {}): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', env.TRUST_PROXY ? 1 : false);
  app.use(countInFlight);
  app.use(requestId);
  app.use(
    pinoHttp({
      logger,
      genReqId: (req) => (req as express.Request).id,
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'info' : 'debug'),
    }),
  );
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          // Photos on S3-compatible storage come from short-lived signed URLs of the bucket's own origin.
          imgSrc: ["'self'", 'data:', 'blob:', ...s3ImageOrigins()],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          frameSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );

  // gzip for text (the web app's scripts and styles, JSON, CSV exports); images and PDFs are left as they are.
  app.use(compression());

  app.use('/api/health', healthRouter());

  app.use('/api', express.json({ limit: '100kb' }));
  app.use(
    '/api',
    session({
      name: 'sf.sid',
      secret: env.SESSION_SECRET,
      store: createSessionStore(),
      resave: false,
      saveUninitialized: false,
      rolling: true,
      proxy: env.TRUST_PROXY,
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: env.COOKIE_SECURE === 'auto' ? 'auto' : env.COOKIE_SECURE === 'true',
        maxAge: env.SESSION_MAX_AGE_HOURS * 60 * 60 * 1000,
        path: '/',
      },
    }),
  );
  app.use('/api', passport.initialize());
  app.use('/api', passport.session() as express.RequestHandler);

  const { csrfSynchronisedProtection, generateToken } = csrfSync({
    getTokenFromRequest: (req) => req.get('x-csrf-token'),
  });
  app.use('/api', csrfSynchronisedProtection);

  app.use('/api/auth', authRouter(generateToken));
  app.use('/api/users', usersRouter());
  app.use('/api/mail', mailRouter());
  app.use('/api/sites/:id/sla', slaRouter());
  app.use('/api/sites', sitesRouter());
  app.use('/api/strings/:id/checks', stringChecksRouter());
  app.use('/api/strings', stringsRouter());
  app.use('/api/module-models', moduleModelsRouter());
  app.use('/api/inverter-models', inverterModelsRouter());
  app.use('/api/inverters', invertersRouter());
  app.use('/api/combiner-boxes', combinerBoxesRouter());
  app.use('/api/work-orders/:id/checks', ticketChecksRouter());
  app.use('/api/work-orders/:id/photos', ticketPhotosRouter());
  app.use('/api/work-orders/:id/diode-replacements', ticketDiodesRouter());
  app.use('/api/work-orders/:id', signOffRouter());
  app.use('/api/work-orders', workOrdersRouter());
  app.use('/api/checks', checksRouter());
  app.use('/api/instruments', instrumentsRouter());
  app.use('/api/photos', photosRouter());
  app.use('/api/diode-replacements', diodesRouter());
  app.use('/api/technicians', techniciansRouter());
  app.use('/api/me', meRouter());
  app.use('/api/fleet', fleetRouter());
  app.use('/api', notFoundApi);

  const webDist = options.webDist === undefined ? env.WEB_DIST : options.webDist;
  if (webDist && fs.existsSync(path.join(webDist, 'index.html'))) {
    app.use(precompressedAssets(webDist));
    app.use(
      express.static(webDist, {
        index: false,
        setHeaders: (res, file) => {
          if (file.includes(`${path.sep}assets${path.sep}`)) res.setHeader('Cache-Control', IMMUTABLE_ASSET);
        },
      }),
    );
    app.get(/^(?!\/api\/).*/, webShell(webDist));
  }

  app.use(errorHandler);
  return app;
}

/** Where signed photo URLs point when evidence lives on S3: the endpoint, or the bucket's virtual host. */
function s3ImageOrigins(): string[] {
  if (!env.s3) return [];
  const endpoint = new URL(env.s3.endpoint);
  return env.s3.forcePathStyle ? [endpoint.origin] : [`${endpoint.protocol}//${env.s3.bucket}.${endpoint.host}`];
}
