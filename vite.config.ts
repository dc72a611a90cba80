/// <reference types="vitest/config" />

import { gzipSync } from 'node:zlib';
import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import type { Plugin } from 'vite';
import { defineConfig } from 'vite';

/**
 * Prints the JavaScript a shopper downloads before the listing page can show: the entry, the
 * listing route, and everything they import statically (the personaliser loads lazily after).
 */
function listingPageSize(): Plugin {
  return {
    name: 'namesake-listing-page-size',
    apply: 'build',
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

const apiPort = process.env.API_PORT ?? '3000';

export default defineConfig({
  plugins: [react(), tailwindcss(), listingPageSize()],
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
