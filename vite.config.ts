import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import type { Plugin } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression } from 'vite-plugin-compression2';
import { VitePWA } from 'vite-plugin-pwa';

const dir = (p: string) => fileURLToPath(new URL(p, import.meta.url));

const packages = (names: string) => new RegExp(`[\\\\/]node_modules[\\\\/](${names})[\\\\/]`);

/** Chunks made by package rather than by page, so each has a plain name and changes only with its packages. */
const PACKAGE_CHUNKS: Record<string, RegExp> = {
  // What every page runs on.
  framework: packages('react|react-dom|scheduler|react-router|@tanstack/[^/]+'),
  // What the forms run on.
  forms: packages('zod|react-hook-form|@hookform/resolvers'),
  // Every icon the app draws (a few hundred bytes each) in one chunk instead of a request apiece.
  icons: packages('lucide-react'),
};
const RECHARTS = packages('recharts');

/** The font file nearly every page needs at once; other subsets load by unicode-range when used. */
const PRELOADED_FONT = 'roboto-flex-latin-wght-normal.woff2';

/**
 * Adds a preload for the emitted (hashed) Latin Roboto Flex file to index.html, so text does not
 * wait for the stylesheet to be read before the font is asked for.
 */
function preloadLatinFont(): Plugin {
  let base = '/';
  return {
    name: 'heatclock:preload-latin-font',
    apply: 'build',
    configResolved(config) {
      base = config.base;
    },
    transformIndexHtml: {
      order: 'post',
      handler(_html, { bundle }) {
        const font = Object.values(bundle ?? {}).find(
          (file) => file.type === 'asset' && file.originalFileNames.some((name) => name.endsWith(`/${PRELOADED_FONT}`)),
        );
        if (!font) throw new Error(`${PRELOADED_FONT} was not emitted: check the font import in src/app/main.tsx.`);
        return [
          {
            tag: 'link',
            attrs: { rel: 'preload', href: `${base}${font.fileName}`, as: 'font', type: 'font/woff2', crossorigin: '' },
            injectTo: 'head',
          },
        ];
      },
    },
  };
}

export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    preloadLatinFont(),
    VitePWA({
      // A new build takes over at once: the shell is hashed files, and an old worker left waiting
      // would serve a shell whose chunks the server no longer has. Nothing here holds unsaved
      // work that a reload would lose (drafts and the queue live in storage).
      registerType: 'autoUpdate',
      injectRegister: false,
      includeAssets: ['favicon.svg'],
      manifest: {
        name: 'Heatclock',
        short_name: 'Heatclock',
        description: 'Growing degree days, maturity windows and bolt warnings for your garden.',
        theme_color: '#f6efe0',
        background_color: '#f6efe0',
        display: 'standalone',
        start_url: '/',
        scope: '/',
        icons: [
          { src: '/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
          { src: '/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
          { src: '/icon-maskable-192.png', sizes: '192x192', type: 'image/png', purpose: 'maskable' },
          { src: '/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
      },
      workbox: {
        // The shell only: the pre-compressed copies are the server's business, not the cache's.
        globPatterns: ['**/*.{js,css,html,woff2,svg,png}'],
        globIgnores: ['**/*.br', '**/*.gz'],
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//],
        cleanupOutdatedCaches: true,
        runtimeCaching: [
          {
            // The GET answers Today, Plantings and a planting's page are drawn from, plus who is
            // signed in and their gardens (the frame cannot open without them). No account,
            // session, mail or export answer, and no write. Inline: workbox copies this function
            // into sw.js as text. Sign-out deletes the cache (src/lib/offline-queue.ts).
            urlPattern: ({ url, sameOrigin }) =>
              sameOrigin &&
              /^\/api\/(auth\/me|gardens|gardens\/\d+(\/(today|alerts\/counts|plantings(\/\d+(\/(log|photos|progress))?)?))?)$/.test(url.pathname),
            method: 'GET',
            handler: 'NetworkFirst',
            options: {
              cacheName: 'heatclock-api',
              networkTimeoutSeconds: 4,
              // Only real answers: a 401 or 500 must never stand in for the last good page.
              cacheableResponse: { statuses: [200] },
              expiration: { maxEntries: 200, maxAgeSeconds: 14 * 24 * 60 * 60 },
            },
          },
        ],
      },
    }),
    // .br and .gz beside each text file for the server to send as they are; fonts and images are compressed already.
    compression({ algorithms: ['brotliCompress', 'gzip'], include: /\.(js|css|svg|html)$/ }),
  ],
  resolve: {
    alias: {
      '@': dir('./src'),
      '#shared': dir('./shared'),
      '#server': dir('./server'),
      '#fixtures': dir('./fixtures'),
    },
  },
  build: {
    outDir: 'dist/client',
    emptyOutDir: true,
    chunkSizeWarningLimit: 500,
    rolldownOptions: {
      // Building a zod schema has no side effects (nothing here calls z.config). Saying so lets an
      // unused schema be dropped, so a page that needs only a module's word lists skips zod.
      treeshake: { manualPureFunctions: ['z'] },
      output: {
        codeSplitting: {
          groups: Object.entries(PACKAGE_CHUNKS).map(([name, test]) => ({ name, test })),
        },
        // Rolldown names a chunk shared by several pages after one of its modules, so "today-…" could
        // be planting-form code; such chunks say "shared-", and the one holding Recharts says so.
        chunkFileNames: (chunk) => {
          if (chunk.facadeModuleId || chunk.name in PACKAGE_CHUNKS) return 'assets/[name]-[hash].js';
          if (chunk.moduleIds.some((id) => RECHARTS.test(id))) return 'assets/recharts-[hash].js';
          return 'assets/shared-[name]-[hash].js';
        },
      },
    },
  },
  server: {
    proxy: { '/api': 'http://127.0.0.1:3000' },
  },
  test: {
    environment: 'node',
    include: ['tests/**/*.test.{ts,tsx}', 'shared/**/*.test.ts'],
    globalSetup: ['tests/helpers/global-setup.ts'],
    setupFiles: ['tests/helpers/setup.ts'],
    // A browser journey on a loaded 2-core machine (CI beside other work) took 20–25 s; the cap is
    // for a hang, not a speed check.
    testTimeout: 45_000,
    hookTimeout: 60_000,
    fileParallelism: true,
    pool: 'forks',
    // Two files at a time: on this 2-core machine the suite takes 413 s instead of 711 s with one
    // (the default of CPUs − 1). Each worker has a database of its own (tests/helpers/worker-db.ts):
    // a drain claims every due garden event, and files fix different "todays".
    maxWorkers: 2,
  },
});
