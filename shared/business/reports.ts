/** Aggregations behind the business charts (each chart also shows its numbers as a table). */
import { format, startOfISOWeek } from 'date-fns';
import { parseDay } from './working-days.ts';

/** The Monday (ISO 8601 week start) of a calendar date, as yyyy-MM-dd. */
export const weekStart = (day: string): string => format(startOfISOWeek(parseDay(day)), 'yyyy-MM-dd');

export type WeekRow = { week: string; salesMinor: number; marginMinor: number; items: number };

export function salesByWeek(lines: ReadonlyArray<{ day: string; salesMinor: number; marginMinor: number; quantity: number }>): WeekRow[] {
  const by = new Map<string, WeekRow>();
  for (const l of lines) {
    const week = weekStart(l.day);
    const r = by.get(week) ?? { week, salesMinor: 0, marginMinor: 0, items: 0 };
    r.salesMinor += l.salesMinor;
    r.marginMinor += l.marginMinor;
    r.items += l.quantity;
    by.set(week, r);
  }
  return [...by.values()].sort((a, b) => a.week.localeCompare(b.week));
}

export type VinylMonthRow = { month: string; materialId: string; material: string; usedMm: number };

export function vinylByMaterialMonth(sheets: ReadonlyArray<{ month: string; materialId: string; material: string; consumedMm: number }>): VinylMonthRow[] {
  const by = new Map<string, VinylMonthRow>();
  for (const s of sheets) {
    const k = `${s.month}|${s.materialId}`;
    const r = by.get(k) ?? { month: s.month, materialId: s.materialId, material: s.material, usedMm: 0 };
    r.usedMm = Math.round((r.usedMm + s.consumedMm) * 10) / 10;
    by.set(k, r);
  }
  return [...by.values()].sort((a, b) => a.month.localeCompare(b.month) || a.material.localeCompare(b.material));
}

export type ListingRow = { listingId: string; title: string; orders: number; items: number; salesMinor: number };

export function ordersByListing(lines: ReadonlyArray<{ listingId: string; title: string; orderId: string; quantity: number; salesMinor: number }>): ListingRow[] {
  const by = new Map<string, ListingRow & { ids: Set<string> }>();
  for (const l of lines) {
    const r = by.get(l.listingId) ?? { listingId: l.listingId, title: l.title, orders: 0, items: 0, salesMinor: 0, ids: new Set<string>() };
    r.ids.add(l.orderId);
    r.orders = r.ids.size;
    r.items += l.quantity;
    r.salesMinor += l.salesMinor;
    by.set(l.listingId, r);
  }
  return [...by.values()].map(({ ids: _ids, ...r }) => r).sort((a, b) => b.orders - a.orders || a.title.localeCompare(b.title));
}
