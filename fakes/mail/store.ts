// Reads the messages the mail fake stored. Used by the admin mail page, tests and e2e.
import fs from 'node:fs';
import path from 'node:path';
import { type AddressObject, simpleParser } from 'mailparser';

export type StoredMailSummary = { id: string; to: string; from: string; subject: string; date: string };
export type StoredMail = StoredMailSummary & { html: string; text: string };

const ID = /^[0-9]{14}-[0-9a-f]{8}$/;

const addr = (a: AddressObject | AddressObject[] | undefined) => (Array.isArray(a) ? a : a ? [a] : []).map((x) => x.text).join(', ');

export function listMailIds(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir)
    .filter((f) => f.endsWith('.eml'))
    .map((f) => f.slice(0, -4))
    .filter((id) => ID.test(id))
    .sort();
}

export async function readMail(dir: string, id: string): Promise<StoredMail | null> {
  if (!ID.test(id)) return null; // never let an id walk out of the folder
  const file = path.join(dir, `${id}.eml`);
  if (!fs.existsSync(file)) return null;
  const parsed = await simpleParser(fs.readFileSync(file));
  return {
    id,
    to: addr(parsed.to),
    from: addr(parsed.from),
    subject: parsed.subject ?? '',
    date: (parsed.date ?? new Date(Number(id.slice(0, 14)))).toISOString(),
    html: typeof parsed.html === 'string' ? parsed.html : '',
    text: parsed.text ?? '',
  };
}

/** One page of the stored messages, newest first: only that page's files are read and parsed. */
export async function mailPage(dir: string, offset: number, limit: number): Promise<{ items: StoredMail[]; total: number }> {
  const ids = listMailIds(dir).reverse();
  const items: StoredMail[] = [];
  for (const id of ids.slice(offset, offset + limit)) {
    const m = await readMail(dir, id);
    if (m) items.push(m);
  }
  return { items, total: ids.length };
}

/** Newest first. */
export async function listMail(dir: string, opts: { to?: string; limit?: number } = {}): Promise<StoredMail[]> {
  const ids = listMailIds(dir).reverse();
  const out: StoredMail[] = [];
  for (const id of ids) {
    const m = await readMail(dir, id);
    if (!m) continue;
    if (opts.to && !m.to.toLowerCase().includes(opts.to.toLowerCase())) continue;
    out.push(m);
    if (opts.limit && out.length >= opts.limit) break;
  }
  return out;
}
