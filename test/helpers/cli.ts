/** Test helpers for the spawned `plumbline` command and scratch CSV files (shared by test/cli and test/hostile). */
import { spawn } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The repository root. */
export const root = fileURLToPath(new URL('../../', import.meta.url));

export interface SpawnedCli {
  readonly status: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

/** Run the CLI from source (no build needed), from the repository root, with PLUMBLINE_DEBUG unset. */
export function cli(...args: string[]): Promise<SpawnedCli> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', 'cli/main.ts', ...args], {
      cwd: root,
      env: { ...process.env, PLUMBLINE_DEBUG: '' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stdout = '';
    let stderr = '';
    child.stdout.setEncoding('utf8').on('data', (d: string) => (stdout += d));
    child.stderr.setEncoding('utf8').on('data', (d: string) => (stderr += d));
    child.on('error', reject);
    child.on('close', (status) => resolve({ status, stdout, stderr }));
  });
}

/** A fresh scratch directory (prefix e.g. 'plumbline-cli-') and a writer of named CSV files in it. */
export function scratchCsv(prefix: string): (name: string, text: string) => string {
  const scratch = mkdtempSync(join(tmpdir(), prefix));
  return (name, text) => {
    const path = join(scratch, name);
    writeFileSync(path, text);
    return path;
  };
}
