// The local server answers only to the address it listens on (and localhost's names on loopback): a page on
// another name that resolves to this machine (DNS rebinding) gets 421, HTTP's "misdirected request".

import { request } from 'node:http';
import { resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { isLoopback, serve, type Serving } from '../src/serve/server.js';

let s: Serving;
beforeAll(async () => {
  s = await serve(resolve('dist/web'), 0);
});
afterAll(() => s.close());

const statusWithHost = (host: string) =>
  new Promise<number>((done, fail) => {
    const u = new URL(s.url);
    // no Host header at all for '' (HTTP/1.0 style)
    const r = request({ host: u.hostname, port: u.port, path: '/', ...(host ? { headers: { host } } : { setHost: false }) }, (resp) => {
      resp.resume();
      done(resp.statusCode ?? 0);
    });
    r.on('error', fail);
    r.end();
  });

describe('serve and the Host header', () => {
  it('answers to its own address and to localhost, refuses any other name', async () => {
    const port = new URL(s.url).port;
    expect(await statusWithHost(`127.0.0.1:${port}`)).toBe(200);
    expect(await statusWithHost(`localhost:${port}`)).toBe(200);
    expect(await statusWithHost(`rebound.example:${port}`)).toBe(421);
    expect(await statusWithHost(`127.0.0.1:${Number(port) + 1}`)).toBe(421);
    // Node's own HTTP server refuses an HTTP/1.1 request without a Host header before ours sees it
    expect([400, 421]).toContain(await statusWithHost(''));
  });
  it('knows loopback addresses from others (warned about at the command line)', () => {
    expect(['127.0.0.1', 'localhost', '::1', '127.1.2.3'].every(isLoopback)).toBe(true);
    expect(['0.0.0.0', '192.168.1.5', '::'].some(isLoopback)).toBe(false);
  });
});
