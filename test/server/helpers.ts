/** Shared helpers for the server suites (not a test file). */
import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { createApp, type AppOptions, type PlumblineApp } from '../../server/app.js';

/** An app whose logger records instead of printing (a logged 500 would show up here). */
export function testApp(options: AppOptions = {}): { app: PlumblineApp; logged: string[] } {
  const logged: string[] = [];
  const app = createApp({ demo: null, ...options, log: (m, e) => logged.push(`${m}: ${String(e)}`) });
  return { app, logged };
}

/** Send a raw request line (no URL normalisation, unlike supertest) to a listening server. */
export function rawGet(server: Server, path: string): Promise<{ status: number; body: string }> {
  const { port } = server.address() as AddressInfo;
  return new Promise((resolve, reject) => {
    const req = httpRequest({ host: '127.0.0.1', port, path, method: 'GET' }, (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (c: string) => (body += c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on('error', reject);
    req.end();
  });
}

/** POST raw bytes as application/json to a listening server. */
export function rawPost(server: Server, path: string, body: Buffer, headers: Record<string, string> = {}): Promise<{ status: number; body: string }> {
  const { port } = server.address() as AddressInfo;
  return new Promise((resolve, reject) => {
    const req = httpRequest(
      { host: '127.0.0.1', port, path, method: 'POST', headers: { 'content-type': 'application/json', 'content-length': String(body.length), ...headers } },
      (res) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (c: string) => (text += c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, body: text }));
      },
    );
    req.on('error', reject);
    req.end(body);
  });
}

export function listen(app: PlumblineApp): Promise<Server> {
  return new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
}

export const sleep = (ms: number): Promise<void> => new Promise((r) => setTimeout(r, ms));
