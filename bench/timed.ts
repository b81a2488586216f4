/**
 * One process under /usr/bin/time: wall time (s), user + system CPU time (s) and peak resident
 * memory (MiB), with its standard output. Shared by the bench scripts.
 */
import { spawn } from 'node:child_process';

export interface ProcRun {
  wall: number;
  cpu: number;
  rssMiB: number;
  stdout: string;
  code: number | null;
}

export function timedProcess(cmd: string, args: readonly string[], cwd: string): Promise<ProcRun> {
  const full = ['-f', 'BENCH_TIME %e %U %S %M', cmd, ...args];
  return new Promise((resolve, reject) => {
    const t0 = performance.now();
    const child = spawn('/usr/bin/time', full, { stdio: ['ignore', 'pipe', 'pipe'], cwd });
    const out: Buffer[] = [];
    let err = '';
    child.stdout.on('data', (d: Buffer) => out.push(d));
    child.stderr.on('data', (d: Buffer) => (err += d.toString()));
    child.on('error', reject);
    child.on('close', (code) => {
      const wallOurs = (performance.now() - t0) / 1000;
      const m = /BENCH_TIME (\S+) (\S+) (\S+) (\d+)/.exec(err);
      if (!m) return reject(new Error(`no timing from /usr/bin/time: ${err.slice(0, 500)}`));
      const stdout = Buffer.concat(out).toString('utf8');
      if (code !== 0) return reject(new Error(`${cmd} ${args.join(' ')} exited ${code}: ${err.slice(0, 500)}`));
      // /usr/bin/time prints wall to 0.01 s; our own clock is finer and includes only spawn overhead.
      resolve({ wall: Math.min(wallOurs, Number(m[1]) + 0.01), cpu: Number(m[2]) + Number(m[3]), rssMiB: Number(m[4]) / 1024, stdout, code });
    });
  });
}
