/**
 * The page's calls to the local server (server/API.md). Every failure becomes an `ApiError`
 * carrying the server's message, so the page can show it as it is.
 */
import type {
  AnalyzeRequestBody,
  AnalyzeResponse,
  DemoAnalysisBody,
  DemoEntry,
  DemoFileBody,
  DemoSettings,
  ErrorBody,
  InputSummary,
  JobViewBody,
  RequestData,
} from '../../core/index.js';

// The request and response shapes are the server's own, from the one shared contract (core/api-types.ts).
export type { AnalyzeResponse, InputSummary };

/** The page always sends its data as CSV text (server/API.md `csv`, `column`, `csvOptions`). */
export type AnalyzeRequest = AnalyzeRequestBody & { readonly csv: string };

/** Grouped counts (server/API.md `grouped`): class limits with counts instead of a value column. */
export type GroupedRequest = AnalyzeRequestBody & { readonly grouped: NonNullable<RequestData['grouped']> };

/** The demo endpoints' shapes, from the shared contract too. */
export type { DemoEntry, DemoSettings };
export type DemoFile = DemoFileBody;
export type DemoAnalysis = DemoAnalysisBody;

export type JobStatus = JobViewBody;

export class ApiError extends Error {
  readonly status: number;
  readonly code: string | undefined;
  readonly field: string | undefined;
  constructor(status: number, message: string, code?: string, field?: string) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.field = field;
  }
}

async function call<T>(method: string, url: string, body?: unknown, signal?: AbortSignal): Promise<T> {
  const init: RequestInit = { method, headers: { Accept: 'application/json' } };
  if (signal) init.signal = signal;
  if (body !== undefined) {
    init.headers = { Accept: 'application/json', 'Content-Type': 'application/json' };
    init.body = JSON.stringify(body);
  }
  const res = await fetch(url, init);
  const text = await res.text();
  let json: unknown = undefined;
  try {
    json = text ? JSON.parse(text) : undefined;
  } catch {
    json = undefined;
  }
  if (!res.ok) {
    const err = (json as { error?: Partial<ErrorBody> } | undefined)?.error;
    throw new ApiError(res.status, err?.message ?? `The server answered ${res.status} ${res.statusText}.`, err?.code, err?.field);
  }
  return json as T;
}

/**
 * Where a request with a large body is: the body being packed (characters of the CSV text done),
 * going up (bytes sent of total), then the server working.
 */
export type SendStage =
  | { readonly stage: 'packing'; readonly done: number; readonly total: number }
  | { readonly stage: 'sending'; readonly loaded: number; readonly total: number }
  | { readonly stage: 'waiting' };

/** Characters of CSV text escaped and encoded per browser task (common practice, no source). */
const PACK_CHARS = 1 << 20;

const nextTask = (): Promise<void> => new Promise((r) => setTimeout(r, 0));

/**
 * The JSON body `{"csv": "...", ...rest}` as a Blob of UTF-8 parts, built one slice of the text per
 * task so that escaping and encoding 10^6 rows never holds the page for long. Slices are escaped
 * with JSON.stringify one by one: a slice that ends inside a surrogate pair gives two `\uXXXX`
 * escapes, which JSON.parse joins back into the same pair (ECMA-262 JSON.parse, JSON.stringify
 * QuoteJSONString).
 */
export async function packBody(csv: string, rest: Record<string, unknown>, onStage: (s: SendStage) => void, signal?: AbortSignal): Promise<Blob> {
  const enc = new TextEncoder();
  const parts: BlobPart[] = [enc.encode('{"csv":"')];
  for (let at = 0; at < csv.length; at += PACK_CHARS) {
    const quoted = JSON.stringify(csv.slice(at, at + PACK_CHARS));
    parts.push(enc.encode(quoted.slice(1, -1)));
    onStage({ stage: 'packing', done: Math.min(csv.length, at + PACK_CHARS), total: csv.length });
    await nextTask();
    if (signal?.aborted) throw new DOMException('The request was aborted.', 'AbortError');
  }
  const tail = JSON.stringify(rest);
  parts.push(enc.encode(tail === '{}' ? '"}' : `",${tail.slice(1)}`));
  return new Blob(parts, { type: 'application/json' });
}

/**
 * POST a JSON body with XMLHttpRequest, whose `upload` events tell how much of the body has gone
 * (fetch gives no upload progress without streaming bodies, which need HTTP/2). Same errors as
 * `call`; an abort rejects with a DOMException named AbortError, as fetch does.
 */
async function postWithProgress<T>(url: string, req: { readonly csv: string }, onStage: (s: SendStage) => void, signal?: AbortSignal): Promise<T> {
  const { csv, ...rest } = req;
  const body = await packBody(csv, rest, onStage, signal);
  return new Promise<T>((resolve, reject) => {
    if (signal?.aborted) {
      reject(new DOMException('The request was aborted.', 'AbortError'));
      return;
    }
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.setRequestHeader('Content-Type', 'application/json');
    xhr.responseType = 'text';
    const onAbort = (): void => xhr.abort();
    signal?.addEventListener('abort', onAbort, { once: true });
    const done = (): void => signal?.removeEventListener('abort', onAbort);
    xhr.upload.addEventListener('progress', (ev) => onStage({ stage: 'sending', loaded: ev.loaded, total: ev.lengthComputable ? ev.total : 0 }));
    xhr.upload.addEventListener('load', () => onStage({ stage: 'waiting' }));
    xhr.addEventListener('abort', () => {
      done();
      reject(new DOMException('The request was aborted.', 'AbortError'));
    });
    xhr.addEventListener('error', () => {
      done();
      reject(new ApiError(0, 'The local server could not be reached.'));
    });
    xhr.addEventListener('load', () => {
      done();
      const text = xhr.responseText;
      let json: unknown = undefined;
      try {
        json = text ? JSON.parse(text) : undefined;
      } catch {
        json = undefined;
      }
      if (xhr.status < 200 || xhr.status >= 300) {
        const err = (json as { error?: Partial<ErrorBody> } | undefined)?.error;
        reject(new ApiError(xhr.status, err?.message ?? `The server answered ${xhr.status} ${xhr.statusText}.`, err?.code, err?.field));
        return;
      }
      resolve(json as T);
    });
    xhr.send(body);
  });
}

export const api = {
  health: () => call<{ ok: boolean; version: string; jobsRunning: number }>('GET', '/api/health'),
  demoList: () => call<{ datasets: DemoEntry[] }>('GET', '/api/demo'),
  demo: (name: string) => call<DemoFile>('GET', `/api/demo/${encodeURIComponent(name)}`),
  demoAnalysis: () => call<DemoAnalysis>('GET', '/api/demo-analysis'),
  analyze: (req: AnalyzeRequest, signal?: AbortSignal) => call<AnalyzeResponse>('POST', '/api/analyze', req, signal),
  analyzeGrouped: (req: GroupedRequest, signal?: AbortSignal) => call<AnalyzeResponse>('POST', '/api/analyze', req, signal),
  startJob: (req: AnalyzeRequest & { client: string }) => call<{ id: string; state: string }>('POST', '/api/jobs', req),
  /** `analyze` and `startJob` with progress of the upload (for large files). */
  analyzeWithProgress: (req: AnalyzeRequest, onStage: (s: SendStage) => void, signal?: AbortSignal) =>
    postWithProgress<AnalyzeResponse>('/api/analyze', req, onStage, signal),
  startJobWithProgress: (req: AnalyzeRequest & { client: string }, onStage: (s: SendStage) => void, signal?: AbortSignal) =>
    postWithProgress<{ id: string; state: string }>('/api/jobs', req, onStage, signal),
  job: (id: string, signal?: AbortSignal) => call<JobStatus>('GET', `/api/jobs/${encodeURIComponent(id)}`, undefined, signal),
  cancelJob: (id: string) => call<{ id: string; state: string }>('DELETE', `/api/jobs/${encodeURIComponent(id)}`),
};
