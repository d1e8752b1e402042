import { afterAll, describe, expect, it } from 'vitest';
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import request from 'supertest';
import { createApp } from '../../server/app';
import { testDb, agent } from '../helpers/test-app';
import { createGarden, createUser, signIn } from '../helpers/factories';
import { Membership } from '../../server/db/models';
import { makeVariety } from '../helpers/garden-records';

/** A built client as `vite build` leaves it: hashed assets with .br and .gz beside them. */
const dir = mkdtempSync(path.join(tmpdir(), 'heatclock-client-'));
const script = `export const words = ${JSON.stringify('Heat adds up day by day. '.repeat(400))};\n`;
const style = `.row { padding: 1rem; }\n`.repeat(200);
mkdirSync(path.join(dir, 'assets'));
writeFileSync(path.join(dir, 'index.html'), `<!doctype html><html><head><script type="module" src="/assets/index-AbC123.js"></script></head><body>${'<!-- shell -->'.repeat(100)}</body></html>`);
for (const [name, text] of [['index-AbC123.js', script], ['index-DeF456.css', style]] as const) {
  writeFileSync(path.join(dir, 'assets', name), text);
  writeFileSync(path.join(dir, 'assets', `${name}.br`), brotliCompressSync(text));
  writeFileSync(path.join(dir, 'assets', `${name}.gz`), gzipSync(text));
}
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const { sequelize, config } = testDb();
const app = createApp({ config, sequelize, clientDir: dir });

describe('what the browser is sent', () => {
  it('when a browser accepting brotli asks for a hashed script or stylesheet, then it gets the brotli file, cached for a year as immutable', async () => {
    for (const [file, type] of [['/assets/index-AbC123.js', /javascript/], ['/assets/index-DeF456.css', /css/]] as const) {
      const res = await request(app).get(file).set('Accept-Encoding', 'gzip, deflate, br');
      expect(res.status).toBe(200);
      expect(res.headers['content-encoding']).toBe('br');
      expect(res.headers['content-type']).toMatch(type);
      expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
      expect(res.headers.vary).toMatch(/Accept-Encoding/i);
    }
  });

  it('when a browser accepts only gzip, then it gets the gzip file; when it accepts none, the plain file', async () => {
    const gz = await request(app).get('/assets/index-AbC123.js').set('Accept-Encoding', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    const plain = await request(app).get('/assets/index-AbC123.js').set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.text).toBe(script);
  });

  it('when the page shell is asked for, at / or a deep link, then it is revalidated every time (no-cache) and compressed', async () => {
    for (const url of ['/', '/g/1/plantings']) {
      const res = await request(app).get(url).set('Accept-Encoding', 'gzip, br');
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toBe('no-cache');
      expect(res.headers['content-encoding']).toBe('br');
      expect(res.headers.etag ?? res.headers['last-modified']).toBeTruthy();
    }
  });

  it('when a JSON answer is above a kilobyte, then it is compressed; a small one is not', async () => {
    const user = await createUser();
    const garden = await createGarden();
    await Membership.create({ userId: user.id, gardenId: garden.id, role: 'viewer' });
    for (let i = 0; i < 30; i++) await makeVariety(garden.id, { name: `Leaf ${i + 1}`, notes: 'Sown every fortnight in the shade bed.' });
    const a = agent(app);
    await signIn(a, user.email);
    const big = await a.get(`/api/gardens/${garden.id}/varieties?pageSize=100`).set('Accept-Encoding', 'gzip, br');
    expect(big.status).toBe(200);
    expect(big.headers['content-encoding']).toBe('br');
    expect(big.body.items.length).toBe(30);
    const small = await a.get('/api/auth/me').set('Accept-Encoding', 'gzip, br');
    expect(small.status).toBe(200);
    expect(small.headers['content-encoding']).toBeUndefined();
  });
});
