// The first load (issue 13, item 3): the built SPA's files go out precompressed (brotli or gzip
// by Accept-Encoding, written at build time), hashed assets are kept a year (immutable) while
// index.html is checked every time, run-time answers (the API's JSON, index.html for a client
// route) are compressed as they go, and every /api answer stays `Cache-Control: no-store`.
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import type express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiForFile } from '../support/api-app';

const h = apiForFile();

// Larger than the 1 kB below which nothing is compressed at run time.
const APP_JS = `console.log(${JSON.stringify('basin '.repeat(400))});\n`;
const PLAIN_JS = `export const rows = ${JSON.stringify(Array.from({ length: 300 }, (_, i) => i))};\n`;
const INDEX = `<!doctype html><title>Basinwright</title><div id="app"></div><!--${'x'.repeat(2000)}-->`;
// The build's .br and .gz carry a marker the original lacks, so the test can tell a file sent
// as precompressed from one compressed afresh by the server.
const MARK = '/* precompressed */';

/** The body as text, decoded from its Content-Encoding by superagent. */
function text(req: request.Test): request.Test {
  return req.buffer(true).parse((res, done) => {
    let body = '';
    res.setEncoding('utf8');
    res.on('data', (chunk: string) => (body += chunk));
    res.on('end', () => done(null, body));
  });
}

describe('serving the built SPA compressed and cached', () => {
  let dist = '';
  let app: express.Express;
  beforeAll(() => {
    dist = mkdtempSync(path.join(tmpdir(), 'bw-dist-'));
    mkdirSync(path.join(dist, 'assets'));
    mkdirSync(path.join(dist, '.vite'));
    writeFileSync(path.join(dist, 'index.html'), INDEX);
    writeFileSync(path.join(dist, 'index.html.br'), brotliCompressSync(INDEX + MARK));
    writeFileSync(path.join(dist, 'index.html.gz'), gzipSync(INDEX + MARK));
    const js = path.join(dist, 'assets', 'index-abc123.js');
    writeFileSync(js, APP_JS);
    writeFileSync(`${js}.br`, brotliCompressSync(APP_JS + MARK));
    writeFileSync(`${js}.gz`, gzipSync(APP_JS + MARK));
    // A hashed asset the build did not compress: compressed on the way out.
    writeFileSync(path.join(dist, 'assets', 'rows-def456.js'), PLAIN_JS);
    writeFileSync(path.join(dist, '.vite', 'manifest.json'), '{}');
    app = h.createApp({ webDist: dist });
  });
  afterAll(() => rmSync(dist, { recursive: true, force: true }));

  it('sends the brotli file to a browser that accepts it, kept a year', async () => {
    const res = await text(
      request(app).get('/assets/index-abc123.js').set('Accept-Encoding', 'gzip, deflate, br'),
    );
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/^(application|text)\/javascript/);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(res.headers.vary).toMatch(/Accept-Encoding/i);
    expect(res.body).toBe(APP_JS + MARK);
  });

  it('sends the gzip file where brotli is not accepted, and the plain file where nothing is', async () => {
    const gz = await text(
      request(app).get('/assets/index-abc123.js').set('Accept-Encoding', 'gzip'),
    );
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.body).toBe(APP_JS + MARK);
    expect(gz.headers['cache-control']).toContain('immutable');
    const plain = await text(
      request(app).get('/assets/index-abc123.js').set('Accept-Encoding', 'identity'),
    );
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body).toBe(APP_JS);
    expect(plain.headers['cache-control']).toContain('immutable');
  });

  it('compresses at run time an asset the build left plain', async () => {
    const res = await text(request(app).get('/assets/rows-def456.js').set('Accept-Encoding', 'br'));
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.body).toBe(PLAIN_JS);
    expect(res.headers['cache-control']).toContain('immutable');
  });

  it('index.html for a client route: precompressed, never cached unchecked', async () => {
    const res = await text(
      request(app).get('/projects/123/design').set('Accept-Encoding', 'gzip, br'),
    );
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['cache-control']).toBe('no-cache');
    expect(res.body).toBe(INDEX + MARK);
    const plain = await text(request(app).get('/').set('Accept-Encoding', 'identity'));
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.headers['cache-control']).toBe('no-cache');
    expect(plain.body).toBe(INDEX);
  });

  it("keeps the build's manifest and missing assets a 404", async () => {
    expect((await request(app).get('/.vite/manifest.json')).status).toBe(404);
    expect((await request(app).get('/assets/missing-0000.js')).status).toBe(404);
  });

  it('compresses API answers and keeps them no-store', async () => {
    const doc = await request(app).get('/api/v1/openapi.json').set('Accept-Encoding', 'gzip');
    expect(doc.status).toBe(200);
    expect(doc.headers['content-encoding']).toBe('gzip');
    expect(doc.headers['cache-control']).toBe('no-store');
    expect(doc.body.openapi).toMatch(/^3\.1/);
    const br = await request(app).get('/api/v1/openapi.json').set('Accept-Encoding', 'br');
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.headers['cache-control']).toBe('no-store');
    // Small answers (under 1 kB) go out plain, still no-store.
    const missing = await request(app).get('/api/v1/nothing-here').set('Accept-Encoding', 'br');
    expect(missing.status).toBe(404);
    expect(missing.headers['content-encoding']).toBeUndefined();
    expect(missing.headers['cache-control']).toBe('no-store');
  });
});
