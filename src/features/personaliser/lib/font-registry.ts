/**
 * The browser's font registry: the same TTF bytes the server reads (GET /api/fonts/:id/file),
 * parsed by the same engine code, so a name's outlines here equal the server's to the micrometre
 * (tests/client/layout-parity.test.ts). Each file is fetched and parsed once per page load.
 * fontkit reads through a DataView, so a plain Uint8Array does; no Buffer polyfill is needed.
 */
import { type FontRegistry, type FontSource, fontRegistry, fontSource, type LoadedFont, loadFont } from '../../../../shared/engine/fonts.ts';
import type { FontInfo } from '../../../../shared/schemas/engine.ts';
import { getBytes } from '../../../lib/api-client.ts';

export type FetchBytes = (url: string) => Promise<Uint8Array>;
export type ClientFont = { font: LoadedFont; source: FontSource };

const byUrl = new Map<string, Promise<ClientFont>>();

export function loadClientFont(info: FontInfo, fetchBytes: FetchBytes = getBytes): Promise<ClientFont> {
  let p = byUrl.get(info.fileUrl);
  if (!p) {
    p = fetchBytes(info.fileUrl).then((bytes) => {
      const source = fontSource(info, bytes);
      return { font: loadFont(source), source };
    });
    // a failed download may be retried on the next call
    p.catch(() => byUrl.delete(info.fileUrl));
    byUrl.set(info.fileUrl, p);
  }
  return p;
}

/** A registry over the given fonts (the ones a listing allows), once all have loaded. */
export async function loadClientRegistry(infos: FontInfo[], ids: string[], fetchBytes?: FetchBytes): Promise<{ registry: FontRegistry; sources: FontSource[] }> {
  const wanted = infos.filter((f) => ids.includes(f.id));
  const loaded = await Promise.all(wanted.map((f) => loadClientFont(f, fetchBytes)));
  const registry = fontRegistry(new Map(loaded.map((l) => [l.font.id, l.font])));
  return { registry, sources: loaded.map((l) => l.source) };
}
