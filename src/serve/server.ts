// `headcheck serve`: a local server for the built page. It serves only the files of that build (a fixed
// table, so no request path reaches the file system), with a strict Content-Security-Policy; no outside requests.

import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { extname, join, relative, sep } from 'node:path';
import { REPORT_SCRIPT_HASH } from '../outputs/html-report.js';
import { InputError } from '../input-error.js';

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.json': 'application/json',
  '.ico': 'image/x-icon',
  '.wasm': 'application/wasm',
};

/**
 * Scripts only from the page itself, plus the report's one inline script (shown in an iframe) by its hash. The
 * check's worker may also compile WebAssembly and make functions from text, both for the DWG reader (LibreDWG's
 * bindings build their call wrappers so); a dedicated worker runs under its own script's policy, so the page
 * itself still refuses both.
 */
function contentSecurityPolicy(worker: boolean): string {
  return [
    "default-src 'none'",
    `script-src 'self' ${worker ? "'wasm-unsafe-eval' 'unsafe-eval'" : `'${REPORT_SCRIPT_HASH}'`}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "worker-src 'self'",
    "connect-src 'self'",
    "frame-src 'self' blob:",
    "base-uri 'none'",
    "form-action 'none'",
    "frame-ancestors 'self'",
  ].join('; ');
}

function filesOf(root: string): Map<string, string> {
  const table = new Map<string, string>();
  const walk = (dir: string) => {
    for (const e of readdirSync(dir, { withFileTypes: true })) {
      const p = join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else table.set(`/${relative(root, p).split(sep).join('/')}`, p);
    }
  };
  walk(root);
  return table;
}

export interface Serving {
  url: string;
  server: Server;
  close(): Promise<void>;
}

/** Whether `host` is a loopback address (the page is meant for this machine only). */
export const isLoopback = (host: string): boolean => host === 'localhost' || /^127\./.test(host) || host === '::1' || host === '[::1]';

/**
 * The Host headers a request may carry: the address listened on and, for loopback, localhost, each with the port.
 * A page on another name that resolves here (DNS rebinding) is refused.
 */
function allowedHosts(host: string, port: number): Set<string> {
  const names = new Set([host, host.includes(':') && !host.startsWith('[') ? `[${host}]` : host]);
  if (isLoopback(host)) for (const n of ['localhost', '127.0.0.1', '[::1]']) names.add(n);
  return new Set([...names].flatMap((n) => [`${n}:${port}`.toLowerCase(), ...(port === 80 ? [n.toLowerCase()] : [])]));
}

export function serve(root: string, port: number, host = '127.0.0.1'): Promise<Serving> {
  if (!existsSync(join(root, 'index.html'))) throw new InputError(`${root}: the page is not built (run "npm run build")`);
  const table = filesOf(root);
  const csp = contentSecurityPolicy(false);
  const workerCsp = contentSecurityPolicy(true);
  let hosts = allowedHosts(host, port);
  const server = createServer((req, res) => {
    const headers = {
      'Content-Security-Policy': csp,
      'X-Content-Type-Options': 'nosniff',
      'Referrer-Policy': 'no-referrer',
      'Cache-Control': 'no-store',
      'Cross-Origin-Opener-Policy': 'same-origin',
    };
    if (!hosts.has((req.headers.host ?? '').toLowerCase())) {
      res.writeHead(421, { ...headers, 'Content-Type': 'text/plain; charset=utf-8' });
      res.end('this server answers only to the address it listens on\n');
      return;
    }
    let path = '/';
    try {
      path = decodeURIComponent(new URL(req.url ?? '/', 'http://local').pathname);
    } catch {
      path = '';
    }
    const file = table.get(path === '/' ? '/index.html' : path);
    if ((req.method !== 'GET' && req.method !== 'HEAD') || !file) {
      res.writeHead(404, { ...headers, 'Content-Type': 'text/plain; charset=utf-8' });
      res.end('not found\n');
      return;
    }
    // Vite names the worker's bundle after its source, src/web/check-worker.ts.
    const policy = /^\/assets\/check-worker-[\w-]+\.js$/.test(path) ? workerCsp : csp;
    res.writeHead(200, {
      ...headers,
      'Content-Security-Policy': policy,
      'Content-Type': TYPES[extname(file)] ?? 'application/octet-stream',
    });
    res.end(req.method === 'HEAD' ? undefined : readFileSync(file));
  });
  return new Promise((resolvePromise, reject) => {
    server.once('error', (err) => reject(new InputError(`--port ${port}: ${(err as NodeJS.ErrnoException).code ?? err.message}`)));
    server.listen(port, host, () => {
      const address = server.address();
      const actual = typeof address === 'object' && address ? address.port : port;
      hosts = allowedHosts(host, actual);
      resolvePromise({ url: `http://${host}:${actual}/`, server, close: () => new Promise((r) => server.close(() => r())) });
    });
  });
}
