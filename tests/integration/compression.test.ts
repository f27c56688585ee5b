/**
 * What the client and the big lists are sent as: compressed where the browser takes it, the right
 * Vary and caching headers, and the same bytes once decoded.
 */
import http, { type IncomingHttpHeaders } from 'node:http';
import type { AddressInfo } from 'node:net';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import type { Express } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '#server/app.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let app: Express;
let clientDir: string;
let builder: string;
const script = `export const rows = [${Array.from({ length: 400 }, (_, i) => `"row ${i}"`).join(',')}];\n`;

beforeAll(async () => {
  ctx = await createTestContext();
  builder = await ctx.authFor('builder');
  clientDir = mkdtempSync(path.join(tmpdir(), 'loomwright-client-'));
  mkdirSync(path.join(clientDir, 'assets'));
  writeFileSync(
    path.join(clientDir, 'index.html'),
    '<!doctype html><title>Loomwright</title><script type="module" src="/assets/index-a1b2c3.js"></script>',
  );
  writeFileSync(path.join(clientDir, 'assets', 'index-a1b2c3.js'), script);
  app = createApp({ env: ctx.env, clientDir });
});
afterAll(async () => {
  rmSync(clientDir, { recursive: true, force: true });
  await ctx.close();
});

/** The bytes of an answer as sent (supertest and fetch would decompress them on the way). */
function raw(url: string, headers: Record<string, string>) {
  return new Promise<{ status: number; headers: IncomingHttpHeaders; body: Buffer }>(
    (resolve, reject) => {
      const server = app.listen(0, '127.0.0.1', () => {
        const { port } = server.address() as AddressInfo;
        http
          .get({ host: '127.0.0.1', port, path: url, headers }, (res) => {
            const chunks: Buffer[] = [];
            res.on('data', (c: Buffer) => chunks.push(c));
            res.on('end', () => {
              server.close();
              resolve({
                status: res.statusCode!,
                headers: res.headers,
                body: Buffer.concat(chunks),
              });
            });
          })
          .on('error', (err) => {
            server.close();
            reject(err);
          });
      });
    },
  );
}

describe('the built client', () => {
  it('sends hashed assets brotli-compressed and cached for a year, immutable', async () => {
    const res = await raw('/assets/index-a1b2c3.js', { 'Accept-Encoding': 'gzip, br' });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers.vary).toMatch(/Accept-Encoding/);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(brotliDecompressSync(res.body).toString('utf8')).toBe(script);
  });

  it('sends gzip to a client without brotli, and plain bytes to one that asks for neither', async () => {
    const gz = await raw('/assets/index-a1b2c3.js', { 'Accept-Encoding': 'gzip' });
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(gz.body).toString('utf8')).toBe(script);
    const plain = await raw('/assets/index-a1b2c3.js', { 'Accept-Encoding': 'identity' });
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body.toString('utf8')).toBe(script);
  });

  it('asks the browser to check the app shell on every visit', async () => {
    for (const url of ['/', '/sign-in', '/conversions/1/pins']) {
      const res = await request(app).get(url);
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toBe('no-cache');
      expect(res.text).toContain('/assets/index-a1b2c3.js');
    }
  });
});

describe('the pin list', () => {
  it('is sent compressed once asked, decoding to the plain answer, with one ETag', async () => {
    const url = `/api/conversions/${ctx.demo.conversions.draft}/pins`;
    const plain = await raw(url, { Authorization: builder, 'Accept-Encoding': 'identity' });
    expect(plain.headers['content-encoding']).toBeUndefined();
    for (const [encoding, decode] of [
      ['br', brotliDecompressSync],
      ['gzip', gunzipSync],
    ] as const) {
      const res = await raw(url, { Authorization: builder, 'Accept-Encoding': encoding });
      expect(res.status).toBe(200);
      expect(res.headers['content-encoding']).toBe(encoding);
      expect(res.headers.vary).toMatch(/Accept-Encoding/);
      expect(res.headers.etag).toBe(plain.headers.etag);
      expect(decode(res.body).equals(plain.body)).toBe(true);
    }
    const again = await request(app).get(url).set({
      Authorization: builder,
      'Accept-Encoding': 'br',
      'If-None-Match': plain.headers.etag!,
    });
    expect(again.status).toBe(304);
  });
});
