/**
 * Start the Plumbline local server:  node --import tsx server/main.ts [options]
 *
 *   --port N            port (default: env PORT, else 5178; 0 = any free port)
 *   --host H            address to listen on (default: env HOST, else 127.0.0.1). Anything other
 *                       than a loopback address also needs --allow-remote, and prints a warning.
 *   --allow-remote      permit a non-loopback --host / HOST
 *   --demo FILE         CSV file analysed at start and shown when the page opens
 *                       (default: datasets/shaft-diameter.csv)
 *   --demo-column C     its value column (name or 1-based number; default: guessed)
 *   --body-limit MIB    largest request body in MiB (default 50)
 *   --workers N         bootstrap worker threads (default and maximum: available parallelism)
 */
import { readFileSync } from 'node:fs';
import { createServer } from 'node:http';
import { basename } from 'node:path';
import { createApp, DEFAULT_BODY_LIMIT, type AppOptions, type DemoChoice } from './app.js';
import { guessValueColumn } from './demo.js';

const DEFAULT_PORT = 5178;
const LOOPBACK = new Set(['127.0.0.1', 'localhost', '::1', '[::1]']);

function fail(message: string): never {
  console.error(`plumbline server: ${message}`);
  process.exit(2);
}

function parseArgs(argv: readonly string[]): Map<string, string | true> {
  const out = new Map<string, string | true>();
  const flags = new Set(['--allow-remote', '--help']);
  const valued = new Set(['--port', '--host', '--demo', '--demo-column', '--body-limit', '--workers']);
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i] as string;
    const eq = a.indexOf('=');
    const name = eq > 0 ? a.slice(0, eq) : a;
    if (flags.has(name)) out.set(name, true);
    else if (valued.has(name)) {
      const v = eq > 0 ? a.slice(eq + 1) : argv[++i];
      if (v === undefined) fail(`${name} needs a value`);
      out.set(name, v);
    } else fail(`unknown option ${a} (see the header of server/main.ts)`);
  }
  return out;
}

function main(): void {
  const args = parseArgs(process.argv.slice(2));
  if (args.has('--help')) {
    console.log('usage: node --import tsx server/main.ts [--port N] [--host H --allow-remote] [--demo FILE [--demo-column C]] [--body-limit MIB] [--workers N]');
    return;
  }
  // An empty variable counts as unset.
  const env = (name: string): string | undefined => {
    const v = process.env[name]?.trim();
    return v === undefined || v === '' ? undefined : v;
  };
  const portText = (args.get('--port') as string | undefined) ?? env('PORT') ?? String(DEFAULT_PORT);
  const port = Number(portText);
  if (!Number.isInteger(port) || port < 0 || port > 65535) fail(`port must be a whole number from 0 to 65535 (got ${portText})`);
  const host = (args.get('--host') as string | undefined) ?? env('HOST') ?? '127.0.0.1';
  const remote = !LOOPBACK.has(host);
  if (remote && !args.has('--allow-remote')) {
    fail(`refusing to listen on ${host}: that makes your data reachable from other machines. Add --allow-remote if you really mean it.`);
  }
  const options: { -readonly [K in keyof AppOptions]: AppOptions[K] } = {};
  if (remote) options.allowedHosts = true;
  const limitText = args.get('--body-limit') as string | undefined;
  if (limitText !== undefined) {
    const mib = Number(limitText);
    if (!(mib > 0 && mib <= 4096)) fail(`--body-limit must be a number of MiB from 0 to 4096 (got ${limitText})`);
    options.bodyLimitBytes = Math.round(mib * 1024 * 1024);
  } else options.bodyLimitBytes = DEFAULT_BODY_LIMIT;
  const workersText = args.get('--workers') as string | undefined;
  if (workersText !== undefined) {
    const w = Number(workersText);
    if (!Number.isInteger(w) || w < 1) fail(`--workers must be a whole number ≥ 1 (got ${workersText})`);
    options.workers = w;
  }
  const demoFile = args.get('--demo') as string | undefined;
  if (demoFile !== undefined) {
    let csv: string;
    try {
      csv = readFileSync(demoFile, 'utf8');
    } catch (e) {
      fail(`cannot read --demo file ${demoFile}: ${(e as Error).message}`);
    }
    const colText = args.get('--demo-column') as string | undefined;
    let column: string | number;
    if (colText !== undefined) column = /^[1-9][0-9]*$/.test(colText) ? Number(colText) : colText;
    else {
      try {
        column = guessValueColumn(csv).defaultColumn;
      } catch (e) {
        fail(`cannot read --demo file ${demoFile} as CSV: ${(e as Error).message}`);
      }
    }
    const demo: DemoChoice = { name: basename(demoFile), csv, column };
    options.demo = demo;
  }
  const app = createApp(options);
  // The address is printed only once listening has succeeded ('listening'); a failure to listen
  // is one line on stderr and exit 2 (express 5's app.listen calls its callback on error too).
  const server = createServer(app);
  server.once('error', (e: NodeJS.ErrnoException) => {
    const where = `${host.includes(':') && !host.startsWith('[') ? `[${host}]` : host}:${port}`;
    if (e.code === 'EADDRINUSE') fail(`${where} is already in use (another program, or another Plumbline, is listening there); stop it or choose another port with --port N`);
    if (e.code === 'EACCES') fail(`no permission to listen on ${where}; choose a port above 1023 with --port N`);
    if (e.code === 'EADDRNOTAVAIL') fail(`cannot listen on ${where}: this machine has no such address`);
    fail(`cannot listen on ${where}: ${e.message}`);
  });
  server.listen(port, host, () => {
    app.pool.warm();
    const addr = server.address();
    const actualPort = typeof addr === 'object' && addr !== null ? addr.port : port;
    const shown = host.includes(':') && !host.startsWith('[') ? `[${host}]` : host;
    if (remote) {
      console.warn(`WARNING: listening on ${host}, reachable from other machines. Plumbline has no login; anyone who can reach this port can read what you analyse.`);
    }
    console.log(`Plumbline is running at http://${shown}:${actualPort}/  (workers: ${app.pool.size}; Ctrl-C to stop)`);
  });
  const stop = (): void => {
    server.close();
    void app.shutdown().finally(() => process.exit(0));
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main();
