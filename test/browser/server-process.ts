/**
 * Helpers for the browser tests: build the page if its sources are newer than client/dist,
 * start the real server as one node process on a free port, and stop it by its pid.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, renameSync, rmSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = fileURLToPath(new URL('../../', import.meta.url));
export const CHROMIUM = '/usr/bin/chromium';
export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** Skip only on a developer machine without Chromium; in CI the tests must run. */
export const SKIP_BROWSER = !existsSync(CHROMIUM) && !process.env['CI'];

function newest(dir: string): number {
  let t = 0;
  for (const name of readdirSync(dir)) {
    if (name === 'dist' || name === 'node_modules') continue;
    const p = join(dir, name);
    const st = statSync(p);
    t = Math.max(t, st.isDirectory() ? newest(p) : st.mtimeMs);
  }
  return t;
}

/** Build client/ into client/dist with vite unless the build is already newer than the sources. */
export async function ensureClientBuilt(): Promise<void> {
  const client = join(ROOT, 'client');
  const built = join(client, 'dist', 'index.html');
  const coreNewest = newest(join(ROOT, 'core'));
  if (existsSync(built) && statSync(built).mtimeMs > Math.max(newest(client), coreNewest)) return;
  // Build beside the old output and swap it in, so that a test reading client/dist at the same
  // time never sees an emptied folder for longer than two renames.
  const { build } = await import('vite');
  mkdirSync(join(ROOT, '.tmp'), { recursive: true }); // .tmp/ is git-ignored
  const fresh = join(ROOT, '.tmp', `client-dist-build-${process.pid}`);
  const old = join(ROOT, '.tmp', `client-dist-old-${process.pid}`);
  await build({ configFile: join(client, 'vite.config.ts'), logLevel: 'warn', build: { outDir: fresh, emptyOutDir: true } });
  const dist = join(client, 'dist');
  if (existsSync(dist)) renameSync(dist, old);
  renameSync(fresh, dist);
  rmSync(old, { recursive: true, force: true });
}

export interface RunningServer {
  readonly url: string;
  readonly child: ChildProcess;
  stop(): Promise<void>;
}

/** Start `node --import tsx server/main.ts` with PORT=0 and wait for the URL it prints. */
export function startServer(timeoutMs = 60_000): Promise<RunningServer> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
      cwd: ROOT,
      env: { ...process.env, PORT: '0', HOST: '127.0.0.1' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    const timer = setTimeout(() => {
      child.kill('SIGKILL');
      reject(new Error(`server did not start in ${timeoutMs} ms; output:\n${out}`));
    }, timeoutMs);
    const onData = (chunk: Buffer): void => {
      out += chunk.toString();
      const m = /(http:\/\/127\.0\.0\.1:\d+\/)/.exec(out);
      if (m) {
        clearTimeout(timer);
        child.stdout?.off('data', onData);
        resolve({
          url: m[1]!,
          child,
          stop: () =>
            new Promise<void>((done) => {
              if (child.exitCode !== null || child.pid === undefined) return done();
              child.once('exit', () => done());
              process.kill(child.pid, 'SIGTERM');
              setTimeout(() => {
                if (child.exitCode === null && child.pid !== undefined) process.kill(child.pid, 'SIGKILL');
              }, 5000).unref();
            }),
        });
      }
    };
    child.stdout?.on('data', onData);
    child.stderr?.on('data', (c: Buffer) => {
      out += c.toString();
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`server exited with ${code} before starting; output:\n${out}`));
    });
  });
}
