// Builds the engine's font registry straight from the TTF bytes, the way the browser does after
// fetching them — no server code involved.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { FONT_CATALOG } from '../../../shared/engine/font-catalog.ts';
import { createFontRegistry, type FontRegistry, fontSource } from '../../../shared/engine/fonts.ts';

const require = createRequire(import.meta.url);

export function fontBytes(id: string): Uint8Array {
  const entry = FONT_CATALOG.find((f) => f.id === id)!;
  return new Uint8Array(readFileSync(require.resolve(entry.packageFile)));
}

let reg: FontRegistry | null = null;
export function testRegistry(): FontRegistry {
  reg ??= createFontRegistry(FONT_CATALOG.map((f) => fontSource(f, fontBytes(f.id))));
  return reg;
}
