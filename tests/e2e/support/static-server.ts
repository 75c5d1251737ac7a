import { createReadStream, existsSync, statSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { extname, join, normalize, resolve } from 'node:path';

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json',
  '.map': 'application/json',
  '.woff2': 'font/woff2',
  '.woff': 'font/woff',
  '.txt': 'text/plain; charset=utf-8',
};

/** A static file server for the built elements on an ephemeral port, with extra in-memory pages. */
export interface StaticServer {
  readonly baseUrl: string;
  /** Adds (or replaces) a page served from memory at `path` (e.g. `/fixture.html`). */
  page(path: string, html: string): string;
  close(): Promise<void>;
}

/**
 * Serves `folder` (e.g. `dist/elements`) over HTTP on 127.0.0.1 and an ephemeral port: module scripts
 * need HTTP, not file://. Paths outside the folder are refused.
 */
export async function serveStatic(folder: string): Promise<StaticServer> {
  const root = resolve(folder);
  const pages = new Map<string, string>();
  const server: Server = createServer((request, response) => {
    const path = decodeURIComponent(new URL(request.url ?? '/', 'http://localhost').pathname);
    const inMemory = pages.get(path);
    if (inMemory !== undefined) {
      response.writeHead(200, { 'Content-Type': TYPES['.html'], 'Cache-Control': 'no-store' });
      response.end(inMemory);
      return;
    }
    const file = normalize(join(root, path.endsWith('/') ? `${path}index.html` : path));
    if (!file.startsWith(root) || !existsSync(file) || !statSync(file).isFile()) {
      response.writeHead(404, { 'Content-Type': 'text/plain' });
      response.end('not found');
      return;
    }
    response.writeHead(200, { 'Content-Type': TYPES[extname(file)] ?? 'application/octet-stream', 'Cache-Control': 'no-store' });
    createReadStream(file).pipe(response);
  });
  await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
  const { port } = server.address() as AddressInfo;
  const baseUrl = `http://127.0.0.1:${port}`;
  return {
    baseUrl,
    page(path: string, html: string): string {
      pages.set(path, html);
      return `${baseUrl}${path}`;
    },
    close: () => new Promise<void>((done) => server.close(() => done())),
  };
}
