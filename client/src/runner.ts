/**
 * Send one analysis to the local server, follow it, and stop it: a plain request, a bootstrap job
 * polled for progress, or a large body sent with upload progress. One run at a time: starting a
 * run or `stop()` abandons the previous one (its request is aborted and its job cancelled on the
 * server). Progress is reported through `onProgress`; the answer through the returned promise,
 * which resolves to null when the run was abandoned or cancelled.
 */
import { api, ApiError, type AnalyzeResponse, type SendStage } from './api.js';
import type { BuiltRequest } from './request.js';

/** Bodies above this size show their packing and sending stages (common practice, no source). */
export const LARGE_BYTES = 1 << 20;

/** Where a run is, for the progress line: fraction null is work of unknown length. */
export interface RunProgress {
  readonly label: string;
  readonly fraction: number | null;
  readonly text: string;
}

export function megabytes(bytes: number): string {
  return `${(bytes / 1e6).toFixed(bytes < 1e7 ? 1 : 0)} MB`;
}

const sleep = (ms: number) => new Promise<void>((r) => setTimeout(r, ms));

export class Runner {
  private abort: AbortController | null = null;
  private jobId: string | null = null;
  private ticket = 0;

  /** `client` identifies this page to the job API, so a new job replaces the page's previous one. */
  constructor(private readonly client: string) {}

  /** Abandon the current run: abort its request, cancel its job. */
  stop(): void {
    this.ticket++;
    this.abort?.abort();
    this.abort = null;
    if (this.jobId) {
      const id = this.jobId;
      this.jobId = null;
      api.cancelJob(id).catch(() => undefined);
    }
  }

  /** Run `built`; null when abandoned (a newer run or stop()) or cancelled on the server. Errors are thrown as ApiError. */
  async run(built: BuiltRequest, onProgress: (p: RunProgress | null) => void, rowsNote: string): Promise<AnalyzeResponse | null> {
    this.stop();
    const ticket = this.ticket;
    const live = (): boolean => ticket === this.ticket;
    const ac = new AbortController();
    this.abort = ac;
    try {
      if (built.kind === 'grouped') return await api.analyzeGrouped(built.request, ac.signal);
      const req = built.request;
      const large = req.csv.length > LARGE_BYTES;
      const onStage = (s: SendStage): void => {
        if (!live()) return;
        if (s.stage === 'packing') onProgress({ label: 'Sending to the local server', fraction: s.done / s.total, text: `packing ${megabytes(s.done)} of ${megabytes(s.total)}` });
        else if (s.stage === 'sending') onProgress({ label: 'Sending to the local server', fraction: s.total > 0 ? s.loaded / s.total : null, text: s.total > 0 ? `${megabytes(s.loaded)} of ${megabytes(s.total)}` : 'starting' });
        else if (req.pMethod === 'bootstrap') onProgress({ label: 'Bootstrap running', fraction: 0, text: '0%' });
        else onProgress({ label: 'Analysing', fraction: null, text: `reading and fitting ${rowsNote}` });
      };
      if (req.pMethod !== 'bootstrap') {
        if (large) onStage({ stage: 'sending', loaded: 0, total: 0 });
        const resp = large ? await api.analyzeWithProgress(req, onStage, ac.signal) : await api.analyze(req, ac.signal);
        return live() ? resp : null;
      }
      onProgress({ label: 'Bootstrap running', fraction: 0, text: '0%' });
      const job = large ? await api.startJobWithProgress({ ...req, client: this.client }, onStage, ac.signal) : await api.startJob({ ...req, client: this.client });
      if (!live()) {
        api.cancelJob(job.id).catch(() => undefined);
        return null;
      }
      this.jobId = job.id;
      for (;;) {
        await sleep(250);
        if (!live()) return null;
        const st = await api.job(job.id);
        if (!live()) return null;
        onProgress({ label: 'Bootstrap running', fraction: st.progress, text: `${Math.round(st.progress * 100)}%` });
        if (st.state === 'done') {
          this.jobId = null;
          return st.result ?? null;
        }
        if (st.state === 'failed') {
          this.jobId = null;
          throw new ApiError(400, st.error?.message ?? 'The analysis failed.', st.error?.code);
        }
        if (st.state === 'cancelled') {
          this.jobId = null;
          return null;
        }
      }
    } catch (err) {
      if (!live() || (err instanceof DOMException && err.name === 'AbortError')) return null;
      throw err;
    } finally {
      if (live()) this.abort = null;
    }
  }
}
