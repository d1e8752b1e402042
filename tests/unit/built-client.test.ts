import { describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { projectRoot } from '../../server/config';

/** The client as `npm test` builds it (scripts/build-client.sh) before the tests run. */
const dist = path.join(projectRoot, 'dist', 'client');
const shell = () => {
  const file = path.join(dist, 'index.html');
  if (!existsSync(file)) throw new Error('Build the client first: npx vite build (npm test does)');
  return readFileSync(file, 'utf8');
};

describe('the built client', () => {
  it('when the page shell loads, then it preloads one font file, the Latin variable Roboto Flex, and that file exists', () => {
    const fonts = [...shell().matchAll(/<link rel="preload" href="([^"]+)" as="font" type="font\/woff2" crossorigin/g)].map((m) => m[1]);
    expect(fonts).toHaveLength(1);
    expect(fonts[0]).toMatch(/^\/assets\/roboto-flex-latin-wght-normal-[\w-]+\.woff2$/);
    expect(existsSync(path.join(dist, fonts[0]))).toBe(true);
  });

  it('when the page shell loads, then nothing it loads or preloads up front holds the chart library', () => {
    const upFront = [...shell().matchAll(/(?:src|href)="(\/assets\/[^"]+\.js)"/g)].map((m) => m[1]);
    expect(upFront.length).toBeGreaterThan(0);
    for (const file of upFront) {
      expect(file).not.toMatch(/recharts|chart/);
      expect(readFileSync(path.join(dist, file), 'utf8')).not.toMatch(/recharts/i);
    }
  });

  it('when the shell is built, then it is the production build: it registers the service worker', () => {
    // A build under NODE_ENV=test has import.meta.env.PROD false, which drops the registration
    // (src/app/main.tsx); npm test exports NODE_ENV=test, so scripts/build-client.sh sets production.
    const scripts = readdirSync(path.join(dist, 'assets')).filter((f) => f.endsWith('.js'));
    expect(scripts.filter((f) => readFileSync(path.join(dist, 'assets', f), 'utf8').includes('/sw.js'))).toHaveLength(1);
    expect(existsSync(path.join(dist, 'sw.js'))).toBe(true);
  });

  it('when assets are built, then every script and stylesheet of 1 kB or more has a brotli and a gzip copy beside it', () => {
    // Below 1 kB a compressed copy can come out larger than the file, and the plugin rightly skips it
    // (the server compresses nothing under 1 kB either: server/app.ts).
    const assets = readdirSync(path.join(dist, 'assets')).filter((f) => /\.(js|css)$/.test(f) && statSync(path.join(dist, 'assets', f)).size >= 1024);
    expect(assets.length).toBeGreaterThan(5);
    for (const f of assets) {
      expect(existsSync(path.join(dist, 'assets', `${f}.br`)), `${f}.br`).toBe(true);
      expect(existsSync(path.join(dist, 'assets', `${f}.gz`)), `${f}.gz`).toBe(true);
    }
  });
});
