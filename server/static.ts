/**
 * Static files of the built page, served only from one folder (client/dist). The request path is
 * decoded once; any segment that is "..", ".", starts with a dot, or contains a backslash, a NUL
 * or a colon is refused, and the resolved real path (symlinks followed) must still lie inside the
 * folder. Anything refused or missing is a 404, so nothing outside the folder can be probed.
 */
import { createReadStream, realpathSync, statSync } from 'node:fs';
import { extname, resolve, sep } from 'node:path';
import type { RequestHandler } from 'express';
import { sendError } from './errors.js';

const TYPES: Readonly<Record<string, string>> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.txt': 'text/plain; charset=utf-8',
  '.map': 'application/json; charset=utf-8',
  '.csv': 'text/csv; charset=utf-8',
};

/** The safe relative path for a URL path, or null when it must be refused. */
export function safeRelativePath(urlPath: string): string | null {
  let decoded: string;
  try {
    decoded = decodeURIComponent(urlPath);
  } catch {
    return null;
  }
  if (!decoded.startsWith('/')) return null;
  const segments = decoded.slice(1).split('/');
  for (let i = 0; i < segments.length; i++) {
    const s = segments[i] as string;
    if (s === '' && i < segments.length - 1) return null; // '//' inside the path
    if (s.startsWith('.') || s.includes('\\') || s.includes('\0') || s.includes(':')) return null;
  }
  let rel = segments.join('/');
  if (rel === '' || rel.endsWith('/')) rel += 'index.html';
  return rel;
}

export function staticFiles(root: string): RequestHandler {
  let realRoot: string | null = null;
  const rootReal = (): string | null => {
    if (realRoot !== null) return realRoot;
    try {
      realRoot = realpathSync(root);
    } catch {
      return null;
    }
    return realRoot;
  };
  return (req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') {
      next();
      return;
    }
    const notFound = (): void => sendError(res, 404, { message: `Not found: ${req.path.slice(0, 200)}`, code: 'not-found' });
    const base = rootReal();
    if (base === null) {
      sendError(res, 404, { message: 'The page has not been built (client/dist is missing). Run the start command from the README, which builds it.', code: 'not-found' });
      return;
    }
    const rel = safeRelativePath(req.path);
    if (rel === null) return notFound();
    const full = resolve(base, rel);
    if (!full.startsWith(base + sep)) return notFound();
    let real: string;
    try {
      real = realpathSync(full);
      if (!real.startsWith(base + sep)) return notFound();
      const st = statSync(real);
      if (!st.isFile()) return notFound();
      res.setHeader('Content-Type', TYPES[extname(real).toLowerCase()] ?? 'application/octet-stream');
      res.setHeader('Content-Length', String(st.size));
      res.setHeader('Cache-Control', 'no-cache');
    } catch {
      return notFound();
    }
    if (req.method === 'HEAD') {
      res.end();
      return;
    }
    const stream = createReadStream(real);
    stream.on('error', () => {
      if (!res.headersSent) notFound();
      else res.destroy();
    });
    stream.pipe(res);
  };
}
