/**
 * The Plumbline local server as an express 5 app: a thin layer over the core. See server/API.md.
 * createApp() builds the app (for supertest, or for main.ts to listen on); `shutdown()` stops
 * its worker threads and cancels running jobs.
 */
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import express, { type Express, type NextFunction, type Request, type RequestHandler, type Response } from 'express';
import { PLUMBLINE_VERSION } from '../core/index.js';
import { DemoStore, type DemoSettings } from './demo.js';
import { errorHandler, HttpError, sendError, type Logger } from './errors.js';
import { hostCheck, securityHeaders } from './headers.js';
import { JobManager, jobViewJson } from './jobs.js';
import { maxWorkers, WorkerPool } from './pool.js';
import { staticFiles } from './static.js';

const here = dirname(fileURLToPath(import.meta.url));
/** The repository root (server/ from sources, dist/server/ when compiled). */
export const REPO_ROOT = resolve(here, import.meta.url.endsWith('.ts') ? '..' : '../..');

/** Default body limit: 50 MiB, enough for 10^6 values as JSON or a 10^6-row CSV. */
export const DEFAULT_BODY_LIMIT = 50 * 1024 * 1024;
/** The demo analysed at start when none is named. */
export const DEFAULT_DEMO = 'bearing-life';

export interface DemoChoice {
  /** Name shown to the user (a dataset name or a file name). */
  readonly name: string;
  readonly csv: string;
  readonly column?: string | number;
  /** Workflow request fields the demo is analysed with (server/demo.ts DEMO_SETTINGS). */
  readonly settings?: DemoSettings;
}

export interface AppOptions {
  /** Largest request body in bytes (default 50 MiB). */
  readonly bodyLimitBytes?: number;
  /** Folder of the built page (default client/dist). */
  readonly staticRoot?: string;
  /** Folder of the demo datasets (default datasets/). */
  readonly datasetsDir?: string;
  /** Worker threads for the bootstrap (default and maximum: os.availableParallelism()). */
  readonly workers?: number;
  /** The demo analysed for `GET /api/demo-analysis` (default: datasets/shaft-diameter.csv); null for none. */
  readonly demo?: DemoChoice | null;
  /** Extra Host header names accepted besides localhost/127.0.0.1/[::1]; `true` accepts any (remote use). */
  readonly allowedHosts?: readonly string[] | true;
  readonly log?: Logger;
  /** Job retention (see JobManager). */
  readonly jobKeepMs?: number;
  readonly maxRunningJobs?: number;
}

export interface PlumblineApp extends Express {
  readonly pool: WorkerPool;
  readonly jobs: JobManager;
  /** Cancel running jobs and stop the worker threads. */
  shutdown(): Promise<void>;
}

const defaultLog: Logger = (message, err) => {
  console.error(`[plumbline] ${message}`);
  if (err !== undefined) console.error(err);
};

function hasBody(req: Request): boolean {
  if (req.headers['transfer-encoding'] !== undefined) return true;
  const len = req.headers['content-length'];
  return len !== undefined && len !== '0';
}

/** POST bodies must be JSON: anything else is a 415 (and no body at all is left for the validator). */
function requireJson(req: Request, _res: Response, next: NextFunction): void {
  if (hasBody(req) && !req.is('application/json')) {
    next(new HttpError(415, `The body must be JSON sent with Content-Type: application/json (got ${JSON.stringify(String(req.headers['content-type'] ?? 'none').slice(0, 80))}).`, { code: 'unsupported-media-type' }));
    return;
  }
  const charset = /;\s*charset\s*=\s*"?([^";\s]+)/i.exec(String(req.headers['content-type'] ?? ''))?.[1];
  if (charset !== undefined && !/^utf-?8$/i.test(charset)) {
    next(new HttpError(415, `Unsupported charset "${charset.slice(0, 40)}": send the JSON as UTF-8.`, { code: 'unsupported-media-type' }));
    return;
  }
  next();
}

/** zlib's errors (gzip, deflate: code Z_*; brotli: ERR__* / ERR_BROTLI*) while body-parser inflates a body. */
function isDecompressionError(err: unknown): err is Error {
  return err instanceof Error && /^(Z_|ERR__|ERR_BROTLI)/.test(String((err as { code?: unknown }).code ?? ''));
}

/** A signal that aborts when the connection closes before the response was sent. */
function clientGone(res: Response): AbortSignal {
  const controller = new AbortController();
  res.on('close', () => {
    if (!res.writableFinished) controller.abort();
  });
  return controller.signal;
}

function methodNotAllowed(allowed: string): RequestHandler {
  return (req, res) => {
    res.setHeader('Allow', allowed);
    sendError(res, 405, { message: `${req.method} is not allowed on ${req.path}; use ${allowed}.`, code: 'method-not-allowed' });
  };
}

export function createApp(options: AppOptions = {}): PlumblineApp {
  const log = options.log ?? defaultLog;
  const bodyLimit = options.bodyLimitBytes ?? DEFAULT_BODY_LIMIT;
  const staticRoot = options.staticRoot ?? resolve(REPO_ROOT, 'client', 'dist');
  const demos = new DemoStore(options.datasetsDir ?? resolve(REPO_ROOT, 'datasets'));
  const pool = new WorkerPool(Math.min(options.workers ?? maxWorkers(), maxWorkers()), log);
  const jobs = new JobManager(pool, {
    log,
    ...(options.jobKeepMs !== undefined ? { keepMs: options.jobKeepMs } : {}),
    ...(options.maxRunningJobs !== undefined ? { maxRunning: options.maxRunningJobs } : {}),
  });

  const app = express() as unknown as PlumblineApp;
  app.disable('x-powered-by');
  app.set('etag', false);
  app.set('query parser', 'simple');
  app.use(securityHeaders());
  if (options.allowedHosts !== true) app.use(hostCheck(options.allowedHosts ?? []));

  // Bodies are taken as bytes and parsed in a worker thread (pool.ts), so a 50 MB upload never
  // blocks the main thread; express.raw still enforces the limit (413).
  const rawParser = express.raw({ limit: bodyLimit, type: 'application/json' });
  // A body that does not decode as its Content-Encoding says is the client's fault: name the coding.
  const raw: RequestHandler = (req, res, next) => {
    rawParser(req, res, (err?: unknown) => {
      if (isDecompressionError(err)) {
        const coding = String(req.headers['content-encoding'] ?? '').slice(0, 40);
        next(
          new HttpError(
            400,
            `The request body does not decode as its header Content-Encoding: ${coding} says (${err.message}). Send plain JSON without a Content-Encoding header, or compress the body as the header says.`,
            { code: 'bad-request' },
          ),
        );
        return;
      }
      next(err);
    });
  };
  const bodyBytes = (req: Request): Uint8Array => {
    const b: unknown = req.body;
    if (b instanceof Uint8Array && b.byteLength > 0) return b;
    throw new HttpError(400, 'The request has no JSON body. Send {"values": [...]} or {"csv": "...", "column": "..."} with Content-Type: application/json.', { code: 'bad-request' });
  };
  const sendJson = (res: Response, status: number, json: string): void => {
    res.status(status).type('application/json').send(json);
  };

  app.get('/api/health', (_req, res) => {
    res.json({ ok: true, version: PLUMBLINE_VERSION, jobsRunning: jobs.running, workers: pool.size });
  });
  app.all('/api/health', methodNotAllowed('GET'));

  app.post('/api/analyze', requireJson, raw, async (req, res) => {
    const body = bodyBytes(req);
    // A client that goes away stops its planning and its bootstrap.
    const { json } = await pool.analyze(body, 'analyze', { signal: clientGone(res) });
    sendJson(res, 200, json);
  });
  app.all('/api/analyze', methodNotAllowed('POST'));

  app.post('/api/jobs', requireJson, raw, async (req, res) => {
    // Until the 202 is sent, a client that goes away stops the planning of its job.
    const view = await jobs.create(bodyBytes(req), clientGone(res));
    sendJson(res, 202, JSON.stringify({ id: view.id, state: view.state, progress: view.progress }));
  });
  app.all('/api/jobs', methodNotAllowed('POST'));

  app.get('/api/jobs/:id', (req, res) => {
    const view = jobs.get(String(req.params.id));
    if (!view) throw new HttpError(404, `No job ${JSON.stringify(String(req.params.id).slice(0, 80))} (unknown, or finished more than 10 minutes ago).`, { code: 'not-found' });
    sendJson(res, 200, jobViewJson(view));
  });
  app.delete('/api/jobs/:id', (req, res) => {
    const view = jobs.cancel(String(req.params.id));
    if (!view) throw new HttpError(404, `No job ${JSON.stringify(String(req.params.id).slice(0, 80))}.`, { code: 'not-found' });
    res.json({ id: view.id, state: view.state });
  });
  app.all('/api/jobs/:id', methodNotAllowed('GET, DELETE'));

  app.get('/api/demo', (_req, res) => {
    res.json({ datasets: demos.list() });
  });
  app.all('/api/demo', methodNotAllowed('GET'));
  app.get('/api/demo/:name', (req, res) => {
    const d = demos.get(String(req.params.name));
    if (!d) throw new HttpError(404, `No demo dataset called ${JSON.stringify(String(req.params.name).slice(0, 80))}; GET /api/demo lists them.`, { code: 'not-found' });
    res.json({ name: d.name, file: d.file, columns: d.columns, defaultColumn: d.defaultColumn, ...(d.settings ? { settings: d.settings } : {}), csv: d.csv });
  });
  app.all('/api/demo/:name', methodNotAllowed('GET'));

  // The demo analysed at start: computed once, on first request, and kept.
  let demoAnalysis: Promise<string> | null = null;
  const demoChoice = (): DemoChoice | null => {
    if (options.demo === null) return null;
    if (options.demo !== undefined) return options.demo;
    const d = demos.get(DEFAULT_DEMO) ?? (() => {
      const first = demos.list()[0];
      return first ? demos.get(first.name) : null;
    })();
    return d ? { name: d.name, csv: d.csv, column: d.settings?.column ?? d.defaultColumn, ...(d.settings ? { settings: d.settings } : {}) } : null;
  };
  app.get('/api/demo-analysis', async (_req, res) => {
    if (demoAnalysis === null) {
      const choice = demoChoice();
      if (choice === null) throw new HttpError(404, 'No demo dataset is available.', { code: 'not-found' });
      const body = Buffer.from(
        JSON.stringify({ csv: choice.csv, ...(choice.column !== undefined ? { column: choice.column } : {}), csvOptions: { skipInvalid: true }, evidence: true, ...(choice.settings?.fields ?? {}) }),
      );
      const p = (async () => {
        const { json } = await pool.analyze(body, 'analyze');
        const column = (JSON.parse(json) as { input: { column?: string } }).input.column ?? String(choice.column ?? '');
        const head = JSON.stringify({ name: choice.name, column, ...(choice.settings ? { settings: choice.settings } : {}), csv: choice.csv });
        return `${head.slice(0, -1)},"result":${json}}`;
      })();
      demoAnalysis = p;
      p.catch(() => {
        if (demoAnalysis === p) demoAnalysis = null; // try again next time
      });
    }
    sendJson(res, 200, await demoAnalysis);
  });
  app.all('/api/demo-analysis', methodNotAllowed('GET'));

  app.all('/api/{*rest}', (req, res) => {
    sendError(res, 404, { message: `No API route ${req.method} ${req.path.slice(0, 200)}; see server/API.md.`, code: 'not-found' });
  });
  app.all('/api', (req, res) => {
    sendError(res, 404, { message: `No API route ${req.method} ${req.path}; see server/API.md.`, code: 'not-found' });
  });

  app.use(staticFiles(staticRoot));
  app.use((req, res) => {
    sendError(res, req.method === 'GET' || req.method === 'HEAD' ? 404 : 405, { message: `Not found: ${req.method} ${req.path.slice(0, 200)}`, code: 'not-found' });
  });
  app.use(errorHandler(log));

  Object.defineProperty(app, 'pool', { value: pool });
  Object.defineProperty(app, 'jobs', { value: jobs });
  Object.defineProperty(app, 'shutdown', {
    value: async (): Promise<void> => {
      jobs.cancelAll();
      await pool.close();
    },
  });
  return app;
}
