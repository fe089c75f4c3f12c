import compression from 'compression';
import express, { type Router } from 'express';
import expressStaticGzip from 'express-static-gzip';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { randomBytes, randomUUID } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { IncomingMessage } from 'node:http';
import type { Pool } from 'pg';
import type { DataSource } from 'typeorm';
import { csrfSync } from 'csrf-sync';
import type { Logger } from 'pino';
import { logger } from './lib/logger';
import { apiNotFound, errorHandler } from './lib/error-handler';
import { pagePreloader, pageReadTags } from './lib/page-preload';
import { absoluteTimeout, sessionMiddleware, type SessionSettings } from './auth/session';
import { createPassport } from './auth/passport';
import { createAuthRateLimits, DEFAULT_AUTH_LIMITS, type AuthLimits } from './auth/rate-limit';
import { authRoutes } from './auth/auth.routes';
import { healthRoutes } from './features/health/health.routes';
import { adminRoutes } from './features/admin/admin.routes';
import { carRoutes } from './features/cars/car.routes';
import { carSetupRoutes, setupRoutes } from './features/setups/setup.routes';
import { changeRoutes } from './features/changes/change.routes';
import { eventRoutes } from './features/events/event.routes';
import { runRoutes } from './features/runs/run.routes';
import { carTyreRoutes, tyreSetRoutes } from './features/tyres/tyre.routes';
import { analysisRoutes } from './features/analysis/analysis.routes';
import type { Mount } from './lib/routes';
import type { MailSettings } from './mail/mailer';
import { carShopGrantRoutes, shopRoutes } from './features/shops/shop.routes';
import { commentRoutes } from './features/comments/comment.routes';
import { notificationRoutes } from './features/notifications/notification.routes';
import { carSuggestionRoutes, suggestionRoutes } from './features/suggestions/suggestion.routes';
import { teamRoutes } from './features/teams/team.routes';
import { invitationRoutes, oneClickUnsubscribe, unsubscribeRoutes } from './features/invitations/invitation.routes';
import { mailboxRoutes } from './features/dev/mailbox.routes';
import { invoiceRoutes, shopInvoiceRoutes, workOrderInvoiceRoutes } from './features/invoices/invoice.routes';
import { paymentWebhookRoutes } from './features/payments/payment.routes';
import type { PaymentSettings } from './features/payments/payment-settings';
import { carWorkOrderRoutes, shopWorkOrderRoutes, workOrderRoutes } from './features/work-orders/work-order.routes';
import { attachmentRoutes } from './features/attachments/attachment.routes';
import type { FileStorage } from './files/storage';
import { eventImportRoutes } from './features/imports/import.routes';
import { exportRoutes, isSeasonFile } from './features/exports/export.routes';

export interface AppOptions {
  ds: DataSource;
  /** pg pool for the session store and rate-limit counters. */
  pool: Pool;
  session: SessionSettings;
  authLimits?: Partial<AuthLimits>;
  /** Built client to serve (vite build output); omitted in API tests and in dev. */
  clientDir?: string;
  /** Behind a TLS-terminating proxy: trust X-Forwarded-* from it. */
  trustProxy?: boolean;
  jsonLimit?: string;
  /** How e-mails go out; without it nothing is sent (notifications still appear in the app). */
  mail?: MailSettings;
  /** Development only: the fake SMTP server's message folder, shown at /api/dev/mailbox. Never set in production. */
  mailboxDir?: string;
  /** The payment service (or its local fake); without it invoices are paid only in cash. */
  payments?: PaymentSettings;
  /** Where attachments are kept (disk or S3); without it the upload routes answer 503. */
  storage?: FileStorage;
  /** Where request and security log lines go; the app's logger (server/lib/logger.ts) by default. */
  logger?: Logger;
}

/** Stands in index.html for the per-response nonce (see the meta tag `csp-nonce`). */
export const CSP_NONCE_PLACEHOLDER = '__CSP_NONCE__';

/** Builds the Express app without listening, so tests can run it on port 0. */
export function createApp(opts: AppOptions) {
  // When PostgreSQL restarts, the session store's idle connections die; without a listener the pool's
  // 'error' event would end the process. The pool drops them and connects afresh on the next request.
  if (opts.pool.listenerCount('error') === 0) {
    opts.pool.on('error', (err) => logger.warn({ err }, 'an idle database connection was closed'));
  }
  const app = express();
  app.disable('x-powered-by');
  if (opts.trustProxy) app.set('trust proxy', 1);

  // A fresh nonce per response: the only way a <style> element may be added at run time
  // (dialogs lock page scrolling with one). Scripts stay 'self' only.
  app.use((_req, res, next) => {
    res.locals.cspNonce = randomBytes(16).toString('base64');
    next();
  });
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          'style-src': ["'self'", (_req, res) => `'nonce-${(res as express.Response).locals.cspNonce}'`],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'"],
          'connect-src': ["'self'"],
          'worker-src': ["'self'"],
          'manifest-src': ["'self'"],
          'object-src': ["'none'"],
          'frame-ancestors': ["'none'"],
          'base-uri': ["'self'"],
          'form-action': ["'self'"],
          'upgrade-insecure-requests': opts.session.secureCookie ? [] : null,
        },
      },
      // Also sets X-Content-Type-Options: nosniff.
    }),
  );
  app.use(
    pinoHttp({
      logger: opts.logger ?? logger,
      genReqId: (_req, res) => {
        const id = randomUUID();
        res.setHeader('X-Request-Id', id);
        return id;
      },
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
      // What the server got wrong is an error; a refusal of access or of too many tries is worth a look
      // (OWASP ASVS 4.0 V7.2.2: failed access decisions are logged); the rest is routine. A 401 is routine too:
      // every signed-out visit asks who is signed in.
      customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : res.statusCode === 403 || res.statusCode === 429 ? 'warn' : 'debug'),
      // Who asked, read when the answer is logged (the session is loaded by then); only on the lines written at
      // `warn` or above; a routine request's empty bindings make no child logger for a line that is not written.
      customProps: (req, res) => (res.statusCode === 403 || res.statusCode === 429 || res.statusCode >= 500 ? { userId: (req as Express.Request).user?.id ?? null } : {}),
    }),
  );

  // gzip for the client's files and the larger API answers (a season, a car's runs): with one bar of
  // signal, bytes are time. The 1 KB threshold leaves small answers alone; sign-in and its tokens are
  // never compressed, so no secret shares a compressed answer with text a request chose (BREACH,
  // https://www.breachattack.com/).
  app.use(compression({ filter: (req, res) => !req.path.startsWith('/api/auth') && compression.filter(req, res) }));

  const mounts: Mount[] = [];
  const mount = (prefix: string, router: Router) => {
    mounts.push({ prefix, router });
    app.use(prefix, router);
  };

  // API answers carry people's records: no browser or shared cache keeps them (OWASP ASVS 8.2.1). A route
  // whose answer may be kept (an attachment's bytes, privately) sets its own header.
  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  mount('/api/health', healthRoutes(opts.ds));
  // The payment service signs the raw body and sends no cookie or CSRF token.
  mount('/api/payments', paymentWebhookRoutes(opts.ds, opts.payments, opts.mail));

  // Season files (up to 5 MB) are read on their own route, after sign-in and the CSRF token.
  // body-parser hands `type` the request Express made, so it has `is`.
  const apiJson = (req: IncomingMessage) => Boolean((req as express.Request).is('application/json')) && !isSeasonFile(req as express.Request);
  app.use('/api', express.json({ limit: opts.jsonLimit ?? '100kb', type: apiJson }));
  app.use('/api', sessionMiddleware(opts.pool, opts.session));
  app.use('/api', absoluteTimeout(opts.session.absoluteMs));
  const passport = createPassport(opts.ds);
  app.use('/api', passport.session());

  const { generateToken, csrfSynchronisedProtection } = csrfSync({
    getTokenFromRequest: (req) => req.headers['x-csrf-token'] as string | undefined,
  });
  app.use('/api', csrfSynchronisedProtection);

  const limits = createAuthRateLimits(opts.pool, { ...DEFAULT_AUTH_LIMITS, ...opts.authLimits });
  mount('/api/auth', authRoutes({ ds: opts.ds, passport, limits, generateCsrfToken: generateToken, mail: opts.mail, idleMs: opts.session.idleMs }));
  mount('/api/admin', adminRoutes(opts.ds, opts.mail));
  mount('/api/cars/:carId/setups', carSetupRoutes(opts.ds));
  mount('/api/cars/:carId/changes', changeRoutes(opts.ds));
  mount('/api/cars/:carId/shop-grants', carShopGrantRoutes(opts.ds, opts.mail));
  mount('/api/cars/:carId/suggestions', carSuggestionRoutes(opts.ds, opts.mail));
  mount('/api/cars/:carId/work-orders', carWorkOrderRoutes(opts.ds));
  mount('/api/cars/:carId', carTyreRoutes(opts.ds));
  mount('/api/cars/:carId', analysisRoutes(opts.ds));
  mount('/api/cars', exportRoutes(opts.ds)); // season export and re-import
  mount('/api/cars', carRoutes(opts.ds, opts.mail));
  mount('/api/setups', setupRoutes(opts.ds));
  mount('/api/events/:eventId/imports', eventImportRoutes(opts.ds)); // timing-sheet import
  mount('/api/events', eventRoutes(opts.ds));
  mount('/api/runs', runRoutes(opts.ds));
  mount('/api/tyre-sets', tyreSetRoutes(opts.ds));
  mount('/api/comments', commentRoutes(opts.ds, opts.mail));
  mount('/api/notifications', notificationRoutes(opts.ds, opts.mail));
  mount('/api/suggestions', suggestionRoutes(opts.ds, opts.mail));
  mount('/api/shops/:shopId/work-orders', shopWorkOrderRoutes(opts.ds));
  mount('/api/shops/:shopId/invoices', shopInvoiceRoutes(opts.ds));
  mount('/api/shops', shopRoutes(opts.ds, opts.mail));
  mount('/api/work-orders/:workOrderId/invoice', workOrderInvoiceRoutes(opts.ds));
  mount('/api/work-orders', workOrderRoutes(opts.ds, opts.mail));
  mount('/api/invoices', invoiceRoutes(opts.ds, opts.payments));
  mount('/api/teams', teamRoutes(opts.ds, opts.mail));
  mount('/api/invitations', invitationRoutes(opts.ds, opts.mail));
  mount('/api/unsubscribe', unsubscribeRoutes(opts.ds, opts.mail));
  mount('/api/attachments', attachmentRoutes(opts.ds, opts.storage, limits)); // uploads
  if (opts.mailboxDir) mount('/api/dev/mailbox', mailboxRoutes(opts.mailboxDir));
  app.use('/api', apiNotFound);
  // RFC 8058: mail programs POST to the List-Unsubscribe address (the page) without cookies or CSRF token.
  app.post('/unsubscribe/:token', ...oneClickUnsubscribe(opts.ds));

  if (opts.clientDir && existsSync(join(opts.clientDir, 'index.html'))) {
    const clientDir = opts.clientDir;
    app.use((req, _res, next) => {
      if (req.path === '/index.html') req.url = '/';
      next();
    });
    // The build keeps a Brotli and a gzip copy beside each script and stylesheet (vite.config.ts,
    // precompress); the browser gets the best it accepts, with no compression work per request.
    app.use(
      expressStaticGzip(clientDir, {
        enableBrotli: true,
        orderPreference: ['br', 'gzip'],
        serveStatic: {
          index: false,
          setHeaders: (res, path) => {
            // Vite names built assets by content hash, so they never change.
            if (path.includes('/assets/')) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
          },
        },
      }),
    );
    // index.html is the only page; it carries the response's style nonce for the client to use.
    // It also names the chunks of the page asked for, so they come beside the main chunk, and the API reads
    // the page makes first, so they go out while the scripts download.
    const indexHtml = readFileSync(join(clientDir, 'index.html'), 'utf8');
    const preloads = pagePreloader(clientDir);
    app.get('/{*splat}', (req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      const search = new URL(req.originalUrl, 'http://localhost').searchParams;
      const html = indexHtml
        .replace(CSP_NONCE_PLACEHOLDER, res.locals.cspNonce as string)
        .replace('</head>', `${preloads(req.path)}${pageReadTags(req.path, search)}</head>`);
      res.type('html').send(html);
    });
  }

  app.use(errorHandler);
  app.locals.mounts = mounts;
  return app;
}
