/// <reference types="vitest/config" />

import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import type { ConfigEnv, Plugin, UserConfig } from 'vite';
import { defineConfig } from 'vite';

/** the browser's build (not the dev server, not the server-render build) */
const clientBuild = (_config: UserConfig, env: ConfigEnv) => env.command === 'build' && !env.isSsrBuild;

/**
 * Prints the JavaScript a shopper downloads before the listing page can show: the entry, the
 * listing route, and everything they import statically (the personaliser loads lazily after).
 */
function listingPageSize(): Plugin {
  return {
    name: 'namesake-listing-page-size',
    apply: clientBuild,
    generateBundle(_options, bundle) {
      const chunks = Object.values(bundle).filter((c) => c.type === 'chunk');
      const byName = new Map(chunks.map((c) => [c.fileName, c]));
      const entry = chunks.find((c) => c.isEntry);
      const listing = chunks.find((c) => c.facadeModuleId?.replace(/\\/g, '/').endsWith('src/app/routes/listing/listing.tsx'));
      if (!entry || !listing) return;
      const seen = new Set<string>();
      const visit = (file: string) => {
        if (seen.has(file)) return;
        seen.add(file);
        for (const i of byName.get(file)?.imports ?? []) visit(i);
      };
      visit(entry.fileName);
      visit(listing.fileName);
      const size = (f: string) => gzipSync((byName.get(f) as { code: string }).code).length;
      const bytes = [...seen].reduce((n, f) => n + size(f), 0);
      console.log(`\nlisting page initial JS: ${(bytes / 1024).toFixed(1)} KB gzip in ${seen.size} files (target ≤ 170 KB; the personaliser loads after)`);
    },
  };
}

/**
 * Preloads the UI font (the Latin part of Nunito: the first paint's text) so text does not wait for
 * the stylesheet to name it; the other scripts' parts load only when a page needs them.
 */
function preloadUiFont(): Plugin {
  return {
    name: 'namesake-preload-ui-font',
    apply: clientBuild,
    transformIndexHtml: {
      order: 'post',
      handler(_html, ctx) {
        const font = Object.keys(ctx.bundle ?? {}).find((f) => /nunito-latin-wght-normal-[\w-]+\.woff2$/.test(f));
        return font ? [{ tag: 'link', attrs: { rel: 'preload', as: 'font', type: 'font/woff2', href: `/${font}`, crossorigin: '' }, injectTo: 'head' }] : [];
      },
    },
  };
}

/**
 * After the client build, builds the server-render entry (src/app/ssr/entry-server.tsx) into
 * dist-ssr/ (beside dist/, so it is never served), so that every `vite build` makes both halves.
 */
function serverEntryBuild(): Plugin {
  return {
    name: 'namesake-server-entry-build',
    apply: clientBuild,
    async closeBundle() {
      const { build } = await import('vite');
      await build({
        configFile: fileURLToPath(import.meta.url),
        logLevel: 'warn',
        build: { ssr: 'src/app/ssr/entry-server.tsx', outDir: 'dist-ssr', emptyOutDir: true, copyPublicDir: false },
      });
    },
  };
}

const apiPort = process.env.API_PORT ?? '3000';

export default defineConfig({
  plugins: [react(), tailwindcss(), listingPageSize(), preloadUiFont(), serverEntryBuild()],
  server: { proxy: { '/api': `http://127.0.0.1:${apiPort}`, '/uploads': `http://127.0.0.1:${apiPort}` } },
  build: { outDir: 'dist', sourcemap: false },
  test: {
    environment: 'node',
    include: ['tests/**/*.test.ts'],
    testTimeout: 20000,
    hookTimeout: 30000,
    pool: 'forks',
  },
});
