/**
 * Reads the bundled TTF files from node_modules and builds the engine's font registry.
 * The same bytes are served at GET /api/fonts/:id/file, so the browser builds an identical registry.
 */

import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { FONT_CATALOG, type FontCatalogEntry } from '../../shared/engine/font-catalog.ts';
import { createFontRegistry, type FontRegistry, fontSource } from '../../shared/engine/fonts.ts';

const require = createRequire(import.meta.url);

export interface FontFile {
  entry: FontCatalogEntry;
  bytes: Uint8Array;
  /** Short content hash, used to version the file URL so it can be cached for a year. */
  hash: string;
}

let files: Map<string, FontFile> | null = null;
let registry: FontRegistry | null = null;

function loadFiles(): Map<string, FontFile> {
  if (files) return files;
  const m = new Map<string, FontFile>();
  for (const entry of FONT_CATALOG) {
    const buf = readFileSync(require.resolve(entry.packageFile));
    const bytes = new Uint8Array(buf.buffer, buf.byteOffset, buf.byteLength);
    m.set(entry.id, { entry, bytes, hash: createHash('sha256').update(bytes).digest('hex').slice(0, 16) });
  }
  files = m;
  return m;
}

/** The exact font file the engine uses, or undefined for an unknown id. */
export function getFontFile(id: string): FontFile | undefined {
  return loadFiles().get(id);
}

export function listFontFiles(): FontFile[] {
  return [...loadFiles().values()];
}

/** The server's font registry (parsed once, on first use). */
export function getFontRegistry(): FontRegistry {
  if (registry) return registry;
  registry = createFontRegistry(listFontFiles().map(({ entry, bytes }) => fontSource(entry, bytes)));
  return registry;
}
