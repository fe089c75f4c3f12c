/// <reference types="vitest/config" />
import { fileURLToPath } from 'node:url';
import { defineConfig, type Plugin } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { brotliCompressSync, constants as zlib, gzipSync } from 'node:zlib';

const r = (p: string) => fileURLToPath(new URL(p, import.meta.url));
const { version } = JSON.parse(readFileSync(r('./package.json'), 'utf8')) as { version: string };

/**
 * Preloads the Latin files of the Nunito Sans weights the pages draw with, so the first text is drawn in its
 * own font. Without it the fonts were found only once the stylesheet applied, arrived after the first render,
 * and swapping them in for the fallback font moved the lines of the trackside page (a layout shift).
 */
function preloadFonts(): Plugin {
  return {
    name: 'scrubline-preload-fonts',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler: (_html, ctx) =>
        Object.keys(ctx.bundle ?? {})
          .filter((file) => /nunito-sans-latin-(400|600|700|800)-normal-[\w-]+\.woff2$/.test(file))
          .sort()
          .map((file) => ({
            tag: 'link',
            attrs: { rel: 'preload', as: 'font', type: 'font/woff2', href: `/${file}`, crossorigin: true },
            injectTo: 'head' as const,
          })),
    },
  };
}

/**
 * Writes a Brotli (quality 11) and a gzip (level 9) copy beside each built script, stylesheet and
 * image of text, for the server to send as they are (express-static-gzip): the best compression,
 * paid once at build time instead of on every request. Brotli makes the main chunk about an eighth
 * smaller than gzip, which a phone with one bar of signal feels.
 */
function precompress(): Plugin {
  return {
    name: 'scrubline-precompress',
    apply: 'build',
    writeBundle: (options, bundle) => {
      for (const file of Object.keys(bundle)) {
        if (!/\.(js|css|svg|webmanifest)$/.test(file)) continue;
        const path = join(options.dir ?? 'dist', file);
        const bytes = readFileSync(path);
        const copies = {
          br: brotliCompressSync(bytes, { params: { [zlib.BROTLI_PARAM_QUALITY]: 11, [zlib.BROTLI_PARAM_SIZE_HINT]: bytes.length } }),
          gz: gzipSync(bytes, { level: 9 }),
        };
        // A tiny file can come out larger; it is then sent as it is.
        for (const [ext, copy] of Object.entries(copies)) if (copy.length < bytes.length) writeFileSync(`${path}.${ext}`, copy);
      }
    },
  };
}

/** The chunks `codeSplitting.groups` makes, and the bundler's runtime, named in their files (see `chunkFileNames`). */
const NAMED_GROUPS = new Set(['app', 'ui', 'zxcvbn', 'trackside', 'rolldown-runtime']);

export default defineConfig({
  define: { __APP_VERSION__: JSON.stringify(version) },
  plugins: [
    react(),
    tailwindcss(),
    preloadFonts(),
    precompress(),
    // An installable app whose shell is kept on the device by a service worker (Workbox, built offline).
    VitePWA({
      registerType: 'autoUpdate',
      injectRegister: false,
      includeAssets: ['favicon.svg', 'icons/apple-touch-icon-180.png'],
      manifest: {
        name: 'Scrubline',
        short_name: 'Scrubline',
        description: 'Season notebook for club racers: runs, setups, pressures and tread, at the car.',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        background_color: '#f3f5f8',
        theme_color: '#0d6b66',
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
      },
      workbox: {
        globPatterns: ['**/*.{js,css,html,svg,png,woff2}'],
        // The password-strength word lists: fetched only by someone choosing a password, not kept on every phone.
        globIgnores: ['**/zxcvbn-*.js'],
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//],
        cleanupOutdatedCaches: true,
      },
    }),
  ],
  resolve: {
    alias: [
      { find: '@', replacement: r('./src') },
      { find: '@shared', replacement: r('./shared') },
      // The router's own production build: its package names only the build with development warnings.
      { find: /^react-router$/, replacement: r('./node_modules/react-router/dist/production/index.mjs') },
      { find: /^react-router\/dom$/, replacement: r('./node_modules/react-router/dist/production/dom-export.mjs') },
    ],
  },
  server: {
    port: 5173,
    proxy: { '/api': { target: `http://127.0.0.1:${process.env.API_PORT ?? 3000}`, changeOrigin: false } },
  },
  build: {
    outDir: 'dist',
    sourcemap: true,
    // Lists each chunk's imports, for scripts/bundle-size.ts.
    manifest: true,
    // Browsers without <link rel="modulepreload"> (older Safari) still load every module, only without
    // the head start; the polyfill would cost every page's first download on every phone.
    modulePreload: {
      polyfill: false,
      // A lazy chunk's list of files to fetch with it leaves out the runtime and the app chunk (script and
      // stylesheet): index.html loads them before anything can import lazily, and each name is a hash
      // that does not compress, repeated in every list.
      // (index.html itself still preloads them.)
      resolveDependencies: (_file, deps, { hostType }) =>
        hostType === 'html' ? deps : deps.filter((dep) => !/^assets\/(rolldown-runtime|app)-[\w-]+\.(js|css)$/.test(dep)),
    },
    rolldownOptions: {
      output: {
        // The small pieces several pages share go by their hash alone: every file a page may load later is
        // named in the first download, so a name there is bytes on every phone's first visit. Pages and the
        // groups below keep their names, for the network panel and the tests that look for them.
        // Hashes in hexadecimal: each name in the first download's list of later files then costs about
        // four bits a character after gzip instead of six; seven of them (28 bits) still tell ~150 files apart
        // (by the birthday bound, two alike in about one build in 20,000).
        hashCharacters: 'hex',
        chunkFileNames: (chunk) => (chunk.isDynamicEntry || NAMED_GROUPS.has(chunk.name) ? 'assets/[name]-[hash:7].js' : 'assets/[hash:7].js'),
        // Fewer, larger files than one per set of shared modules: fewer requests, and each compresses
        // better. The service worker keeps every chunk on the device either way.
        codeSplitting: {
          groups: [
            // What every page needs before it draws: React, the router, TanStack Query, zod, the API
            // client, the signed-in shell.
            { name: 'app', tags: ['$initial'], priority: 3, test: (id) => !/[\\/](index\.html|src[\\/]main\.tsx)$/.test(id) },
            // The small UI primitives pages share (not the Radix dialog and toasts, loaded on use, nor the
            // password field, its eye icons and the strength meter, which only the sign-in and password pages draw,
            // nor the text box for a few sentences, which only the shop's, the admin's and the suggestion pages use,
            // nor the way back above a heading, which the trackside page does not draw).
            {
              name: 'ui',
              priority: 2,
              minShareCount: 2,
              test: (id) =>
                /[\\/]src[\\/]components[\\/]ui[\\/]/.test(id) && !/[\\/](dialog|toast-layer|password-field|password-strength|text-area|back-link)\.tsx$/.test(id),
            },
            // The password-strength estimator and its word lists (zxcvbn-ts): large, and loaded only when
            // someone types a new password (src/lib/password-strength.ts).
            { name: 'zxcvbn', priority: 4, test: /[\\/]node_modules[\\/]@zxcvbn-ts[\\/]/ },
            // The trackside page and everything else it needs, in one file: at the car, with a weak
            // signal, it opens in a handful of requests. Pages that share some of it load this file too.
            { name: 'trackside', priority: 1, test: /[\\/]src[\\/]app[\\/]routes[\\/]events[\\/]event-day\.tsx$/ },
          ],
        },
      },
    },
  },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['tests/shared/**/*.test.ts', 'tests/client/**/*.test.{ts,tsx}', 'tests/scripts/**/*.test.ts'],
          environment: 'node',
          // A form test types a dozen values key by key (user-event): about a second alone, past 5 s when the two
          // cores are shared with the server tests running beside it. Findings still give up on their own.
          testTimeout: 15_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          include: ['tests/server/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/server/global-setup.ts'],
          testTimeout: 20_000,
          hookTimeout: 30_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.spec.ts'],
          environment: 'node',
          globalSetup: ['tests/e2e/global-setup.ts'],
          setupFiles: ['tests/e2e/failure-report.ts'],
          // A test walking through a dozen screens takes half a minute on two busy cores; each wait inside it
          // still gives up on its own after 30 s, so a stuck page is reported there, not here.
          testTimeout: 120_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
