import path from 'node:path';
import { existsSync } from 'node:fs';
import compression from 'compression';
import cookieParser from 'cookie-parser';
import express, { Router } from 'express';
import helmet from 'helmet';
import type { Env } from './config/env.ts';
import { setConfig } from './config/runtime.ts';
import { logger } from './lib/logger.ts';
import { authenticate } from './middleware/authenticate.ts';
import { apiNotFound, errorHandler } from './middleware/error-handler.ts';
import { requestContext, requireJsonForWrites } from './middleware/request-context.ts';
import {
  attachmentRoutes,
  connectorAttachmentRoutes,
} from './modules/attachments/attachments.routes.ts';
import { authRoutes } from './modules/auth/auth.routes.ts';
import { auditRoutes } from './modules/audit/audit.routes.ts';
import { benchPhotoRoutes, benchRoutes } from './modules/bench/bench.routes.ts';
import { calcRoutes } from './modules/calc/calc.routes.ts';
import { checksRoutes } from './modules/checks/checks.routes.ts';
import { conversionsRoutes } from './modules/conversions/conversions.routes.ts';
import { feedsRoutes } from './modules/feeds/feeds.routes.ts';
import { conversionHarnessRoutes, wireRoutes } from './modules/harness/harness.routes.ts';
import {
  connectorImportRoutes,
  conversionImportRoutes,
  pinoutRoutes,
} from './modules/imports/imports.routes.ts';
import { conversionLibraryRoutes, libraryRoutes } from './modules/library/library.routes.ts';
import { mailRoutes } from './modules/mail/mail.routes.ts';
import {
  connectorRoutes,
  conversionPinMapRoutes,
  pinRoutes,
} from './modules/pin-map/pin-map.routes.ts';
import { revisionsRoutes } from './modules/revisions/revisions.routes.ts';
import { usersRoutes } from './modules/users/users.routes.ts';
import { worksheetRoutes } from './modules/worksheets/worksheet.routes.ts';
import { workshopRoutes } from './modules/workshop/workshop.routes.ts';

export interface AppOptions {
  env: Env;
  /** Folder of the built client to serve; omitted in API tests. */
  clientDir?: string;
}

const IMMUTABLE = 'public, max-age=31536000, immutable';

/** Builds the Express app without listening, so tests can drive it with supertest. */
export function createApp({ env, clientDir }: AppOptions) {
  setConfig(env);
  logger.level = env.LOG_LEVEL;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', env.TRUST_PROXY_HOPS);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'font-src': ["'self'"],
          'object-src': ["'none'"],
          'frame-ancestors': ["'none'"],
          'upgrade-insecure-requests': null,
        },
      },
      strictTransportSecurity: { maxAge: 31_536_000, includeSubDomains: true },
    }),
  );
  app.use(requestContext);
  // Brotli where the client takes it, else gzip; bodies that arrive already encoded (the cached
  // lists) pass through. Vary: Accept-Encoding is set on everything compressible.
  app.use(compression());

  const api = Router();
  api.use(requireJsonForWrites);
  api.use(express.json({ limit: '100kb' }));
  api.use(cookieParser());
  api.get('/health', (_req, res) => {
    res.json({ ok: true });
  });
  api.use('/auth', authRoutes(env));
  // Everything below needs a session; the role checks sit on each route.
  api.use('/workshop', authenticate, workshopRoutes);
  api.use('/users', authenticate, usersRoutes);
  api.use(
    '/conversions',
    authenticate,
    conversionsRoutes,
    conversionPinMapRoutes,
    feedsRoutes,
    checksRoutes,
    worksheetRoutes,
    revisionsRoutes,
    auditRoutes,
    benchRoutes,
    conversionImportRoutes,
    conversionLibraryRoutes,
    conversionHarnessRoutes,
  );
  api.use('/admin', authenticate, mailRoutes);
  api.use('/calc', authenticate, calcRoutes);
  api.use(
    '/connectors',
    authenticate,
    connectorRoutes,
    connectorImportRoutes,
    connectorAttachmentRoutes,
  );
  api.use('/attachments', authenticate, attachmentRoutes);
  api.use('/bench-photos', authenticate, benchPhotoRoutes);
  api.use('/library', authenticate, libraryRoutes);
  api.use('/pinouts', authenticate, pinoutRoutes);
  api.use('/pins', authenticate, pinRoutes);
  api.use('/wires', authenticate, wireRoutes);
  api.use(apiNotFound);
  app.use('/api', api);

  if (clientDir && existsSync(clientDir)) {
    app.use(
      express.static(clientDir, {
        index: false,
        setHeaders: (res, file) => {
          // Vite names what it emits under assets/ by content hash: a new build, a new name.
          const hashed = path.relative(clientDir, file).startsWith(`assets${path.sep}`);
          res.setHeader('Cache-Control', hashed ? IMMUTABLE : 'no-cache');
        },
      }),
    );
    // Client-side routes: every other GET gets the app shell, checked again on every visit so a
    // new build is picked up at once.
    app.get(/^\/(?!api\/).*/, (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(path.join(clientDir, 'index.html'));
    });
  }

  app.use(errorHandler);
  return app;
}
