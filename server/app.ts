import express, { type ErrorRequestHandler, type Express, type Router } from 'express';
import helmet from 'helmet';
import { randomUUID } from 'node:crypto';
import { pinoHttp } from 'pino-http';
import { componentLogger } from './log';
import type { Sequelize } from 'sequelize';
import { AppError } from './errors';
import { databaseUnavailable, isDatabaseUnreachable } from './db/availability';
import { createAuthenticator } from './auth/passport';
import { authRouter } from './resources/auth/router';
import { usersRouter } from './resources/users/router';
import { healthRouter, type Health } from './resources/health/router';
import { auditEventsRouter } from './resources/audit-events/router';
import { mailRouter } from './resources/mail/router';
import { calculationsRouter } from './resources/calculations/router';
import { serveWebClient } from './web';
import { sitesRouter } from './resources/sites/router';
import { meterRunsRouter } from './resources/meter-runs/router';
import { meterRunHistoryRouter } from './resources/meter-run-history/router';
import { elementCareCertificateRouter, elementCareRouter } from './resources/element-care/router';
import { transmittersRouter } from './resources/transmitters/router';
import { devicesRouter } from './resources/devices/router';
import { importsRouter } from './resources/imports/router';
import { readingsRouter } from './resources/readings/router';
import { readingConflictsRouter } from './resources/reading-conflicts/router';
import { liveRouter } from './resources/live/router';
import { alarmsRouter } from './resources/alarms/router';
import { alarmLimitsRouter } from './resources/alarm-limits/router';
import { alarmPerformanceRouter } from './resources/alarm-performance/router';
import { rangeHealthRouter } from './resources/range-health/router';
import { careDueRouter } from './resources/care-due/router';
import { reconciliationsRouter } from './resources/reconciliations/router';
import { recordVersionsRouter } from './resources/record-versions/router';
import { correctionsRouter } from './resources/corrections/router';
import { periodsRouter } from './resources/periods/router';
import { monthlyVolumesRouter } from './resources/monthly-volumes/router';
import { exportsRouter } from './resources/exports/router';
import { balanceGroupsRouter } from './resources/balance-groups/router';
import { calibrationCertificatesRouter, transmitterCalibrationsRouter } from './resources/calibrations/router';
import { certificatesDirBeside } from './certificates/store';
import { LiveBoard } from './live-board';
import type { Services } from './services';

export interface AppOptions {
  sequelize: Sequelize;
  jwtSecret: string;
  tokenHours: number;
  loginLimit: number;
  /** Express's `trust proxy` from TALLYRUN_TRUST_PROXY; absent or false trusts no X-Forwarded-For. */
  trustProxy?: boolean | number | string;
  health: () => Promise<Health>;
  services: Services;
  webDir?: string;
  maxUploadBytes?: number;
}

/** Builds the Express app; it does not listen (tests hand it to supertest). */
export function createApp(options: AppOptions): Express {
  const app = express();
  app.set('trust proxy', options.trustProxy ?? false);
  app.disable('x-powered-by');
  // The content security policy is set by serveWebClient, which hashes the export's inline blocks.
  app.use(helmet({ contentSecurityPolicy: false }));
  // API answers (the sign-in token above all) are never kept by a browser or a proxy (issue 12 §10).
  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  app.use(requestLog);
  app.use(express.json({ limit: '1mb' }));

  const authenticate = createAuthenticator(options.jwtSecret);
  const publicRoutes: [string, Router][] = [
    ['/health', healthRouter(options.health)],
    ['/auth', authRouter({ ...options, authenticate })],
  ];
  const { services, sequelize } = options;
  // A set-up change reaches ingest (the transmitter catalog) and the live board at once.
  const setupChanged = () => {
    services.catalog.invalidate();
    services.live.readingsStored([]);
  };
  const signedInRoutes: [string, Router][] = [
    ['/users', usersRouter(sequelize)],
    ['/audit-events', auditEventsRouter(services.pool)],
    ['/mail', mailRouter()],
    ['/calculations', calculationsRouter()],
    [
      '/sites',
      sitesRouter(sequelize, {
        // Dated site settings (issue 9): the site's meter runs recompute from the version's time only.
        settingsChanged: async (meterRunIds, from, reference) => {
          if (meterRunIds.length)
            await services.history.queueHours(meterRunIds, from.getTime(), Date.now(), {
              cause: 'configuration-version',
              reference,
            });
        },
      }),
    ],
    [
      '/meter-runs',
      meterRunsRouter(sequelize, {
        configChanged: async (meterRunId, from, configVersionId) => {
          setupChanged();
          await services.history.queueHours([meterRunId], from.getTime(), Date.now(), {
            cause: 'configuration-version',
            reference: configVersionId ?? null,
          });
        },
      }),
    ],
    ['/meter-runs', meterRunHistoryRouter(services.pool)],
    [
      '/meter-runs',
      // Element calibrations, gas analyses and inspections (issue 11): their versions recompute as any other.
      elementCareRouter(
        sequelize,
        {
          configChanged: async (meterRunId, from, configVersionId) => {
            setupChanged();
            await services.history.queueHours([meterRunId], from.getTime(), Date.now(), {
              cause: 'configuration-version',
              reference: configVersionId ?? null,
            });
          },
        },
        { uploadDir: services.uploadDir, certificatesDir: certificatesDirBeside(services.uploadDir) },
      ),
    ],
    // Their certificates, downloaded by every signed-in role.
    [
      '/element-calibrations',
      elementCareCertificateRouter(sequelize, 'calibration', {
        certificatesDir: certificatesDirBeside(services.uploadDir),
      }),
    ],
    [
      '/gas-analyses',
      elementCareCertificateRouter(sequelize, 'analysis', {
        certificatesDir: certificatesDirBeside(services.uploadDir),
      }),
    ],
    [
      '/element-inspections',
      elementCareCertificateRouter(sequelize, 'inspection', {
        certificatesDir: certificatesDirBeside(services.uploadDir),
      }),
    ],
    [
      '/transmitters',
      transmittersRouter(sequelize, {
        changed: setupChanged,
        // A dated re-range (issue 9): the meter run recomputes from the version's time only.
        rangeChanged: (meterRunId, from, reference) =>
          services.history.queueHours([meterRunId], from.getTime(), Date.now(), {
            cause: 'configuration-version',
            reference,
          }),
      }),
    ],
    [
      '/devices',
      devicesRouter(sequelize, {
        brokerAddress: () => services.brokerControl.address,
        credentialsChanged: (username) => {
          services.deviceAuth.forget();
          // A disabled device is cut off now, not when it next signs in.
          services.brokerControl.disconnect(username);
        },
      }),
    ],
    [
      '/imports',
      importsRouter({
        pool: services.pool,
        uploadDir: services.uploadDir,
        originalsDir: services.originalsDir,
        maxBytes: options.maxUploadBytes ?? 200e6,
        jobs: services.imports,
      }),
    ],
    ['/readings', readingsRouter(services.pool)],
    // Re-sent readings that differed from the stored ones (issue 9): listed, resolved by engineers.
    ['/reading-conflicts', readingConflictsRouter(sequelize)],
    ['/live', liveRouter(new LiveBoard(services.pool), services.live)],
    // Alarms (issue 5): the list and lifecycle, limits per meter run or transmitter, range health.
    ['/alarms', alarmsRouter(services.pool)],
    ['/alarm-limits', alarmLimitsRouter(services.pool)], // new limits apply from the next evaluation (within a minute)
    // A site's monthly alarm performance against ISA-18.2 (issue 13 item 9): every role reads.
    ['/alarm-performance', alarmPerformanceRouter(services.pool)],
    ['/meter-runs', rangeHealthRouter(services.pool)],
    // What is due in the care of a site's meters (issue 11 §4): every role reads.
    ['/sites', careDueRouter(services.pool)],
    // Reconciliation against field totals (issue 10 §2): every role reads; the tolerance is configuration.
    ['/reconciliations', reconciliationsRouter(services.pool, sequelize)],
    // Record versions (issue 9): every version of an hourly record or a total, first against current.
    ['/meter-runs', recordVersionsRouter(services.pool)],
    // Corrections with four eyes (issue 9): an approval recomputes the correction's hours.
    [
      '/corrections',
      correctionsRouter({
        sequelize,
        pool: services.pool,
        approved: (meterRunId, fromMs, toMs, correctionId) =>
          services.history.queueHours([meterRunId], fromMs, toMs, { cause: 'correction', reference: correctionId }),
      }),
    ],
    // Period close per site and contract month (issue 10): a reopen recomputes the month, held hours included.
    [
      '/periods',
      periodsRouter({
        sequelize,
        reopened: (meterRunIds, fromMs, toMs, reference) =>
          services.history.queueHours(meterRunIds, fromMs, toMs, { cause: 'reopen', reference }),
      }),
    ],
    // Month end (issue 10): the accountant's monthly volumes and their exports (audited).
    ['/monthly-volumes', monthlyVolumesRouter(services.pool)],
    ['/exports', exportsRouter(services.pool, sequelize)],
    // Station balances and pro-rata allocation (issue 10 §3, §4): every role reads; engineers define groups.
    ['/balance-groups', balanceGroupsRouter(sequelize)],
    // Calibrations of transmitters with their certificates (issue 11 §1): every role reads; engineers record.
    [
      '/transmitters',
      transmitterCalibrationsRouter({
        sequelize,
        uploadDir: services.uploadDir,
        certificatesDir: certificatesDirBeside(services.uploadDir),
      }),
    ],
    [
      '/calibrations',
      calibrationCertificatesRouter({
        sequelize,
        uploadDir: services.uploadDir,
        certificatesDir: certificatesDirBeside(services.uploadDir),
      }),
    ],
  ];
  const api = express.Router();
  for (const [path, router] of publicRoutes) api.use(path, router);
  // Everything below needs a valid token.
  api.use(authenticate);
  for (const [path, router] of signedInRoutes) api.use(path, router);
  app.locals.apiRoutes = listRoutes([...publicRoutes, ...signedInRoutes]);
  api.use((req, _res, next) =>
    next(new AppError(404, 'not_found', `No API route ${req.method} ${req.baseUrl}${req.path}.`)),
  );
  app.use('/api', api);

  if (options.webDir) serveWebClient(app, options.webDir);
  app.use(errorHandler);
  return app;
}

/**
 * One log line per request with a request id: the caller's `X-Request-Id` when it sends one
 * (a proxy in front), otherwise a new one; it is echoed in the response so a person reporting a
 * problem can quote it. Tokens and cookies never reach the log.
 */
const requestLog = pinoHttp({
  logger: componentLogger('http'),
  genReqId: (req, res) => {
    const given = req.headers['x-request-id'];
    const id = typeof given === 'string' && /^[\w.-]{1,100}$/.test(given) ? given : randomUUID();
    res.setHeader('X-Request-Id', id);
    return id;
  },
  redact: ['req.headers.authorization', 'req.headers.cookie'],
  // A 4xx is the caller's mistake, answered; only a 5xx or a dropped request is the server's.
  customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : 'info'),
  // The live board's event stream and the health probe would otherwise fill the log.
  autoLogging: { ignore: (req) => /^\/api\/(health|live\/stream)(\?|$)/.test(req.url ?? '') },
});

const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof AppError) return res.status(err.status).json(err.toJSON());
  // body-parser's errors carry a status and a type; a malformed JSON body names the body as its field.
  if (err && typeof err === 'object' && 'type' in err) {
    const type = (err as { type: string }).type;
    if (type === 'entity.parse.failed')
      return res
        .status(400)
        .json(new AppError(400, 'invalid_json', 'The request body is not valid JSON.', 'body').toJSON());
    if (type === 'entity.too.large')
      return res.status(413).json(new AppError(413, 'too_large', 'The request body is too large.', 'body').toJSON());
  }
  // The database went away under the request (a restart, an outage): 503 saying so, not a 500.
  if (isDatabaseUnreachable(err)) {
    req.log.warn({ err: { message: (err as Error).message }, url: req.originalUrl }, 'database unreachable');
    return res.status(503).json(databaseUnavailable().toJSON());
  }
  req.log.error({ err, method: req.method, url: req.originalUrl }, 'request failed');
  res
    .status(500)
    .json(new AppError(500, 'internal', 'Something went wrong on the server; it has been logged.').toJSON());
};

/** `METHOD /api/path` of every route, read from the routers themselves (the role-matrix test uses it). */
function listRoutes(mounts: [string, Router][]): string[] {
  const routes: string[] = [];
  for (const [mount, router] of mounts) {
    for (const layer of router.stack as { route?: { path: string; methods: Record<string, boolean> } }[]) {
      if (!layer.route) continue;
      for (const method of Object.keys(layer.route.methods)) {
        const path = layer.route.path === '/' ? '' : layer.route.path;
        routes.push(`${method.toUpperCase()} /api${mount}${path}`);
      }
    }
  }
  return routes.sort();
}
