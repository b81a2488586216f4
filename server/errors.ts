/**
 * HTTP errors and the final error handler. Every client fault becomes a 4xx with
 * `{ "error": { "message", "field"?, "code"?, "place"? } }`; anything else is a bug: logged, and
 * answered with a generic 500 that leaks nothing.
 */
import type { ErrorRequestHandler, Response } from 'express';
import { isPlumblineError, type ErrorBody } from '../core/index.js';

/** The `error` of every 4xx/5xx body: the shared contract (core/api-types.ts). */
export type { ErrorBody };

export class HttpError extends Error {
  readonly status: number;
  readonly field: string | undefined;
  readonly code: string | undefined;
  constructor(status: number, message: string, opts: { field?: string; code?: string } = {}) {
    super(message);
    this.name = 'HttpError';
    this.status = status;
    this.field = opts.field;
    this.code = opts.code;
  }
}

/** A client fault already turned into its response (e.g. found in a worker thread). */
export class ClientFault extends Error {
  readonly status: number;
  readonly body: ErrorBody;
  constructor(status: number, body: ErrorBody) {
    super(body.message);
    this.name = 'ClientFault';
    this.status = status;
    this.body = body;
  }
}

/**
 * A worker thread died while running part of an analysis (a crash or out of memory, not the
 * request's fault): the analysis stopped and can be retried. Its message is for the user.
 */
export class WorkerFailed extends Error {
  readonly detail: string;
  constructor(cause: unknown) {
    super(WORKER_FAILED_MESSAGE);
    this.name = 'WorkerFailed';
    this.detail = cause instanceof Error ? cause.message : String(cause);
  }
}

/** What the client is told when a worker died under its analysis. */
export const WORKER_FAILED_MESSAGE = 'The analysis stopped because a worker failed; it can be retried.';

export function badRequest(message: string, field?: string, code = 'bad-request'): HttpError {
  return new HttpError(400, message, field === undefined ? { code } : { field, code });
}

export function sendError(res: Response, status: number, body: ErrorBody): void {
  if (res.headersSent) return;
  res.status(status).type('application/json').send(JSON.stringify({ error: body }));
}

/** Map a thrown value to (status, body) if it is a client fault; null for a bug. */
export function clientFault(err: unknown): { status: number; body: ErrorBody } | null {
  if (err instanceof ClientFault) return { status: err.status, body: err.body };
  if (err instanceof HttpError) {
    return {
      status: err.status,
      body: { message: err.message, ...(err.field !== undefined ? { field: err.field } : {}), ...(err.code !== undefined ? { code: err.code } : {}) },
    };
  }
  if (isPlumblineError(err)) {
    if (err.code === 'bad-parameter' || err.code === 'not-computable') {
      // A family's parameters out of bounds or an uncomputable step are the core's bug, not the user's.
      return null;
    }
    const place = err.place && Object.keys(err.place).length > 0 ? { place: err.place } : {};
    // 422: the request is well formed, but these data (fewer than 2 failures) need an assumed shape to be answered.
    return { status: err.code === 'cancelled' ? 409 : err.code === 'needs-assumed-shape' ? 422 : 400, body: { message: err.message, code: err.code, ...place } };
  }
  // A route parameter whose percent-encoding is not valid UTF-8 (the router's decodeURIComponent).
  if (err instanceof URIError && (err as { status?: unknown }).status === 400) {
    return {
      status: 400,
      body: { message: `The address has bad percent-encoding (${err.message.replace(/^Failed to decode param /, 'in ').slice(0, 120)}): each %XY must be two hex digits and together they must spell UTF-8 text.`, code: 'bad-request' },
    };
  }
  // body-parser (express.json) errors carry a 4xx status and a type.
  if (typeof err === 'object' && err !== null && 'type' in err && 'status' in err) {
    const e = err as { type: unknown; status: unknown; limit?: unknown; message?: unknown };
    const status = typeof e.status === 'number' ? e.status : 500;
    if (status >= 400 && status < 500) {
      switch (e.type) {
        case 'entity.too.large':
          return {
            status: 413,
            body: {
              message: `The request body is larger than the server's limit of ${formatBytes(Number(e.limit))}. Send fewer values, or start the server with a larger --body-limit.`,
              code: 'body-too-large',
            },
          };
        case 'entity.parse.failed':
          return { status: 400, body: { message: `The request body is not valid JSON (${String(e.message ?? 'parse error')}).`, code: 'bad-request' } };
        case 'encoding.unsupported':
          return { status: 415, body: { message: `Unsupported Content-Encoding: ${String(e.message ?? '')}. Send the JSON uncompressed, or as gzip, deflate or br.`, code: 'unsupported-media-type' } };
        case 'charset.unsupported':
          return { status: 415, body: { message: `Unsupported body encoding: ${String(e.message ?? '')}. Send UTF-8 JSON.`, code: 'unsupported-media-type' } };
        case 'request.aborted':
          return { status: 400, body: { message: 'The request was aborted by the client.', code: 'bad-request' } };
        default:
          return { status, body: { message: String(e.message ?? 'Bad request.'), code: 'bad-request' } };
      }
    }
  }
  return null;
}

export function formatBytes(n: number): string {
  if (!Number.isFinite(n)) return 'the configured size';
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(n % (1024 * 1024) === 0 ? 0 : 1)} MiB`;
  if (n >= 1024) return `${(n / 1024).toFixed(n % 1024 === 0 ? 0 : 1)} KiB`;
  return `${n} bytes`;
}

export type Logger = (message: string, err?: unknown) => void;

export function errorHandler(log: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    const fault = clientFault(err);
    if (fault) {
      sendError(res, fault.status, fault.body);
      return;
    }
    if (err instanceof WorkerFailed) {
      log(`worker failed on ${req.method} ${req.path}: ${err.detail}`);
      res.setHeader('Retry-After', '1');
      sendError(res, 503, { message: err.message, code: 'worker-failed' });
      return;
    }
    log(`internal error on ${req.method} ${req.path}`, err);
    sendError(res, 500, { message: 'Internal error; the server log has the details.' });
  };
}
