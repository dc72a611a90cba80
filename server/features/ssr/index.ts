// Public module of the ssr feature: server-rendered public pages (the entry is src/app/ssr/entry-server.tsx,
// built to dist-ssr/), robots.txt and sitemap.xml, and the composed-preview cache the listing image shares.
import fs from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { SsrEntry } from '../../../shared/ssr-contract.ts';

export { seoRouter } from './seo.routes.ts';
export { fillTemplate, type SsrSetup, ssrPages } from './ssr.routes.ts';
export { composeCached, type PreviewCache } from './ssr-data.ts';

/** Where `vite build` puts the server entry: dist-ssr/ beside the client's dist/ (never served). */
export const ssrEntryFile = (clientDir: string) => path.join(path.dirname(clientDir), 'dist-ssr', 'entry-server.js');

/** Loads the built entry once, on first use; null when there is no build of it. */
export function builtSsrEntry(clientDir: string): () => Promise<SsrEntry | null> {
  let loading: Promise<SsrEntry | null> | undefined;
  return () => {
    loading ??= (async () => {
      const file = ssrEntryFile(clientDir);
      if (!fs.existsSync(file)) return null;
      const mod = (await import(pathToFileURL(file).href)) as { entry: SsrEntry };
      return mod.entry;
    })();
    return loading;
  };
}
