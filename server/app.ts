import { existsSync } from 'node:fs';
import { join } from 'node:path';
import compression from 'compression';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import type { DataSource } from 'typeorm';
import { clientPages } from './http/client-page';
import { requireCsrfToken } from './http/csrf';
import { apiNotFound, errorHandler } from './http/error-handler';
import { assaysRouter } from './modules/assays/assays.router';
import { attachmentsRouter } from './modules/attachments/attachments.router';
import { auditRouter } from './modules/audit/audit.router';
import { authRouter } from './modules/auth/auth.router';
import { createPassport } from './modules/auth/passport';
import { campaignsRouter } from './modules/campaigns/campaigns.router';
import { comparisonsRouter } from './modules/comparisons/comparisons.router';
import { digestsRouter } from './modules/digests/digests.router';
import { unsubscribeRouter } from './modules/digests/unsubscribe.router';
import { enzymesRouter } from './modules/enzymes/enzymes.router';
import { exportsRouter } from './modules/exports/exports.router';
import { fitsRouter } from './modules/fits/fits.router';
import { healthRouter } from './modules/health/health.router';
import { importsRouter } from './modules/imports/imports.router';
import { invitationsRouter } from './modules/invitations/invitations.router';
import { resolveMailOptions, type MailOptions } from './modules/mail/mail-options';
import { outboxRouter } from './modules/mail/outbox.router';
import { measurementsRouter } from './modules/measurements/measurements.router';
import { overviewRouter } from './modules/overview/overview.router';
import { passwordResetsRouter } from './modules/password-resets/password-resets.router';
import { phProfilesRouter } from './modules/ph-profiles/ph-profiles.router';
import { DatabaseSessionStore } from './modules/sessions/database-session-store';
import { usersRouter } from './modules/users/users.router';
import { variantsRouter } from './modules/variants/variants.router';

export interface AppOptions {
  sessionSecret: string;
  /** Express "trust proxy"; when set, cookies are marked secure on TLS requests. */
  trustProxy?: string;
  /** Built client to serve (dist/client); omitted in API tests. */
  clientDir?: string;
  /** The data folder; uploaded files are stored under it. Without it the attachment routes are not mounted. */
  dataDir?: string;
  /** Link base, sender, time zone, digest schedule and delivery of e-mail; see MailOptions for the defaults. */
  mail?: Partial<MailOptions>;
}

const sessionLifetimeMs = 7 * 24 * 60 * 60 * 1000;

/** Builds the Express app on an open data source. It does not listen; index.ts and the tests do. */
export function createApp(dataSource: DataSource, options: AppOptions): Express {
  const app = express();
  const mail = resolveMailOptions(options.mail);
  app.disable('x-powered-by');
  if (options.trustProxy) app.set('trust proxy', parseTrustProxy(options.trustProxy));

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          // Charts run through vega-interpreter, so no 'unsafe-eval' is needed.
          scriptSrc: ["'self'"],
          // Chart tooltips and embed actions set inline styles.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          frameSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'self'"],
          upgradeInsecureRequests: null,
        },
      },
    }),
  );

  const sessionStore = new DatabaseSessionStore(dataSource);
  app.locals.sessionStore = sessionStore;
  const passport = createPassport(dataSource);

  const api = express.Router();
  api.use(express.json({ limit: '2mb' }));
  api.use(
    session({
      name: 'kcatalog.sid',
      secret: options.sessionSecret,
      store: sessionStore,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      proxy: Boolean(options.trustProxy),
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: options.trustProxy ? 'auto' : false,
        maxAge: sessionLifetimeMs,
      },
    }),
  );
  api.use(passport.session());
  api.use('/health', healthRouter());
  // Before the CSRF check: one-click unsubscribe (RFC 8058) arrives without a session; the link's token is the credential.
  api.use('/digests/unsubscribe', unsubscribeRouter(dataSource));
  api.use(requireCsrfToken);
  api.use('/auth', authRouter(dataSource, passport, sessionStore));
  api.use('/users', usersRouter(dataSource, sessionStore));
  // Before the /variants and /campaigns routers: it serves /variants/:id/comparison and /campaigns/:id/{cycles,landscape}.
  api.use(comparisonsRouter(dataSource));
  if (options.dataDir) api.use(attachmentsRouter(dataSource, options.dataDir));
  api.use('/assays', assaysRouter(dataSource));
  api.use('/measurements', measurementsRouter(dataSource));
  api.use('/ph-profiles', phProfilesRouter(dataSource));
  api.use('/fits', fitsRouter());
  api.use('/enzymes', enzymesRouter(dataSource));
  api.use('/campaigns', campaignsRouter(dataSource));
  api.use('/variants', variantsRouter(dataSource));
  api.use('/audit', auditRouter(dataSource));
  if (options.dataDir) api.use('/imports', importsRouter(dataSource, options.dataDir));
  api.use('/exports', exportsRouter(dataSource));
  api.use('/overview', overviewRouter(dataSource));
  api.use('/invitations', invitationsRouter(dataSource, mail));
  api.use('/password-resets', passwordResetsRouter(dataSource, mail));
  api.use('/outbox', outboxRouter(dataSource, mail.delivery));
  api.use('/digests', digestsRouter(dataSource, mail));
  api.use(apiNotFound);
  app.use('/api', api);

  if (options.clientDir && existsSync(join(options.clientDir, 'index.html'))) {
    const clientDir = options.clientDir;
    // Only the client's files are compressed: the grid and chart chunks shrink to about a third, while the
    // API's pages are mostly small and the registry's are cached as ready bytes that gzip would redo each time.
    app.use(compression());
    // Vite puts a content hash in every file name under assets/, so those never change; index.html may.
    app.use('/assets', express.static(join(clientDir, 'assets'), { index: false, immutable: true, maxAge: '1y', fallthrough: false }));
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    // Client routes (Express 5 syntax for "everything else"). The page names the hashed files of the
    // current build, so the browser asks again each time (no-cache) and mostly gets a 304.
    const clientPage = clientPages(clientDir);
    app.get('/{*splat}', (req, res) => {
      res.type('html').set('Cache-Control', 'no-cache').send(clientPage(req.path));
    });
  }

  app.use(errorHandler);
  return app;
}

function parseTrustProxy(value: string): boolean | number | string {
  if (value === 'true') return true;
  if (value === 'false') return false;
  return /^\d+$/.test(value) ? Number(value) : value;
}
