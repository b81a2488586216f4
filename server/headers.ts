/**
 * Security headers on every response (issue 6): a Content-Security-Policy that allows no inline
 * script and no framing, no MIME sniffing, no referrer; API responses are never cached.
 */
import type { RequestHandler } from 'express';

export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self'",
  "style-src 'self'",
  "img-src 'self' data: blob:",
  "connect-src 'self'",
  "font-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join('; ');

export function securityHeaders(): RequestHandler {
  return (req, res, next) => {
    res.setHeader('Content-Security-Policy', CONTENT_SECURITY_POLICY);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Referrer-Policy', 'no-referrer');
    res.setHeader('X-Frame-Options', 'DENY');
    res.setHeader('Cross-Origin-Opener-Policy', 'same-origin');
    res.setHeader('Cross-Origin-Resource-Policy', 'same-origin');
    if (req.path.startsWith('/api/') || req.path === '/api') res.setHeader('Cache-Control', 'no-store');
    next();
  };
}

/**
 * Refuse requests whose Host header names another machine (DNS-rebinding defence for a server on
 * loopback): only localhost, 127.0.0.1, [::1] and the names in `extra` are accepted.
 * Common practice, no source.
 */
export function hostCheck(extra: readonly string[] = []): RequestHandler {
  const allowed = new Set(['localhost', '127.0.0.1', '[::1]', ...extra.map((h) => h.toLowerCase())]);
  return (req, res, next) => {
    const host = (req.headers.host ?? '').toLowerCase();
    const name = host.startsWith('[') ? host.slice(0, host.indexOf(']') + 1) : host.split(':')[0] ?? '';
    if (allowed.has(name)) {
      next();
      return;
    }
    res
      .status(421)
      .type('application/json')
      .send(JSON.stringify({ error: { message: `This server only answers requests addressed to this machine (Host "${host.slice(0, 100)}" refused).`, code: 'bad-host' } }));
  };
}
