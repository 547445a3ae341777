import { existsSync } from 'node:fs';
import path from 'node:path';

import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import expressStaticGzip from 'express-static-gzip';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';

import type { AppContext } from './app-context.ts';
import { ACCESS_POLICY } from './auth/access-policy.ts';
import { guard } from './auth/authenticate.ts';
import { originCheck } from './auth/origin-check.ts';
import { errorHandler } from './http/error-handler.ts';
import { HttpError } from './http/http-error.ts';
import { readiness } from './http/readiness.ts';
import { httpLogSerializers } from './logging/logger.ts';
import { renderDevMailbox } from './mail/dev-mailbox-page.ts';
import { API_AREAS } from './routes/api-routes.ts';
import { authRouter } from './routes/auth.ts';
import { invitationsRouter } from './routes/invitations.ts';

/** Builds the Express app: security headers, logging, the API, the dev mailbox and the web build. */
export function createApp(ctx: AppContext): Express {
  const app = express();
  app.disable('x-powered-by');
  // Proxy trust is explicit (TRUST_PROXY, default none): otherwise any client could pick its own address.
  app.set('trust proxy', ctx.config.TRUST_PROXY);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // react-native-web injects style tags; Metro's web export loads workers from blobs for three.
          'script-src': ["'self'", "'unsafe-inline'", "'wasm-unsafe-eval'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'worker-src': ["'self'", 'blob:'],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );
  app.use(pinoHttp({ logger: ctx.logger, serializers: httpLogSerializers, wrapSerializers: false, autoLogging: { ignore: (req) => !req.url?.startsWith('/api') } }));
  app.use(cookieParser());
  app.use('/api', originCheck(ctx.config));
  app.use(express.json({ limit: '2mb' }));

  // Liveness: the process answers. Readiness: the database answers and every migration is applied.
  app.get('/healthz', (_req, res) => {
    res.json({ ok: true });
  });
  app.get('/readyz', readiness(ctx));

  // Public API: sign-in and invitation acceptance.
  app.use('/api/auth', authRouter(ctx));
  app.use('/api/invitations', invitationsRouter(ctx));

  // Everything else under /api passes the one guard with its area's roles.
  for (const { area, path: mount, router } of API_AREAS) {
    app.use(`/api${mount}`, guard(ctx.db, ctx.tokens, ACCESS_POLICY[area]), router(ctx));
  }
  app.use('/api/*splat', (_req, _res, next) => next(new HttpError(404, 'not_found', 'No such API route.')));
  app.use('/api', (_req, _res, next) => next(new HttpError(404, 'not_found', 'No such API route.')));

  if (ctx.config.DEV_MAILBOX && ctx.devMailbox) {
    const mailbox = ctx.devMailbox;
    app.get('/dev/mail', (_req, res) => {
      res.type('html').send(renderDevMailbox(mailbox));
    });
    app.get('/dev/mail.json', (_req, res) => {
      res.json({ messages: mailbox });
    });
  }

  const web = ctx.config.WEB_DIST;
  if (web && existsSync(path.join(web, 'index.html'))) {
    // The build's .br/.gz copies (server/scripts/compress-web.ts) go to browsers that accept them.
    app.use(expressStaticGzip(web, { index: false, enableBrotli: true, orderPreference: ['br', 'gz'], serveStatic: { index: false, maxAge: '1h' } }));
    // Client-side routes: every other GET gets the single-page app.
    app.get('/{*splat}', (_req, res) => {
      res.sendFile(path.join(web, 'index.html'));
    });
  }

  app.use(errorHandler);
  return app;
}
