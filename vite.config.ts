import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import type { Plugin } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression } from 'vite-plugin-compression2';

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
    testTimeout: 20_000,
    hookTimeout: 60_000,
    fileParallelism: true,
    pool: 'forks',
    // Two files at a time: on this 2-core machine the suite takes 413 s instead of 711 s with one
    // (the default of CPUs − 1); the tests share the test database by design (own rows, leases).
    maxWorkers: 2,
  },
});
