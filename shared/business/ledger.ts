/**
 * The shop's ledger as the seller reads it: each movement signed from the shop's side (a fee is
 * money the shop did not get, so it is negative), month by month, and as CSV (papaparse).
 */
import Papa from 'papaparse';
import { dayInZone } from './working-days.ts';

export const LEDGER_KINDS = ['charge', 'platform_fee', 'transfer', 'refund', 'refund_reversal'] as const;
export type LedgerKind = (typeof LEDGER_KINDS)[number];
export const LEDGER_KIND_LABELS: Record<LedgerKind, string> = {
  charge: 'Charge',
  platform_fee: 'Platform fee',
  transfer: 'Transfer to you',
  refund: 'Refund',
  refund_reversal: 'Taken back from a transfer',
};

export type LedgerEntry = {
  id: string;
  at: number;
  /** yyyy-MM-dd in the shop's time zone */
  day: string;
  kind: LedgerKind;
  orderId: string | null;
  orderNumber: string | null;
  /** as stored (charges, fees and transfers positive; refunds, reversals and fees returned with a refund negative) */
  amountMinor: number;
  /** from the shop's side: what the shop earned (+) or gave up (−); 0 for money merely moved */
  earnedMinor: number;
  /** what reached (+) or left (−) the shop's payout account */
  paidOutMinor: number;
  currency: string;
  memo: string | null;
};

/** Splits a stored movement into earned and paid out, from the shop's side. */
export function signForShop(kind: string, amountMinor: number): { earnedMinor: number; paidOutMinor: number } {
  switch (kind) {
    case 'charge':
      return { earnedMinor: amountMinor, paidOutMinor: 0 };
    case 'platform_fee':
      // a fee is stored positive; the part returned with a refund is stored negative
      return { earnedMinor: -amountMinor, paidOutMinor: 0 };
    case 'refund':
      return { earnedMinor: -Math.abs(amountMinor), paidOutMinor: 0 };
    case 'transfer':
      return { earnedMinor: 0, paidOutMinor: amountMinor };
    case 'refund_reversal':
      return { earnedMinor: 0, paidOutMinor: -Math.abs(amountMinor) };
    default:
      return { earnedMinor: 0, paidOutMinor: 0 };
  }
}

export type MonthBalance = {
  /** yyyy-MM */
  month: string;
  chargesMinor: number;
  feesMinor: number;
  refundsMinor: number;
  earnedMinor: number;
  paidOutMinor: number;
  /** earned − paid out, this month */
  netMinor: number;
  /** earned − paid out since the first entry: what the shop is still owed at the month's end */
  balanceMinor: number;
};

/** Month by month, oldest first, with a running balance (earned − paid out). */
export function balanceByMonth(entries: readonly LedgerEntry[]): MonthBalance[] {
  const by = new Map<string, MonthBalance>();
  for (const e of [...entries].sort((a, b) => a.at - b.at)) {
    const month = e.day.slice(0, 7);
    let m = by.get(month);
    if (!m) by.set(month, (m = { month, chargesMinor: 0, feesMinor: 0, refundsMinor: 0, earnedMinor: 0, paidOutMinor: 0, netMinor: 0, balanceMinor: 0 }));
    if (e.kind === 'charge') m.chargesMinor += e.earnedMinor;
    if (e.kind === 'platform_fee') m.feesMinor += e.earnedMinor;
    if (e.kind === 'refund') m.refundsMinor += e.earnedMinor;
    m.earnedMinor += e.earnedMinor;
    m.paidOutMinor += e.paidOutMinor;
    m.netMinor = m.earnedMinor - m.paidOutMinor;
  }
  let running = 0;
  return [...by.values()].sort((a, b) => a.month.localeCompare(b.month)).map((m) => ((running += m.netMinor), { ...m, balanceMinor: running }));
}

/** Minor units as a plain decimal for spreadsheets ("-12.50"), digits from ISO 4217 via the caller. */
export function minorToDecimal(amountMinor: number, digits: number): string {
  if (digits === 0) return String(amountMinor);
  const neg = amountMinor < 0;
  const abs = Math.abs(amountMinor);
  const s = String(abs).padStart(digits + 1, '0');
  return `${neg ? '-' : ''}${s.slice(0, -digits)}.${s.slice(-digits)}`;
}

/**
 * The ledger as CSV (RFC 4180 quoting by papaparse). Formula-like text (=, +, -, @ first) in the
 * memo is prefixed with an apostrophe so a spreadsheet never runs it (OWASP, "CSV Injection").
 */
export function ledgerCsv(entries: readonly LedgerEntry[], digits: number): string {
  const safe = (s: string | null) => (s && /^[=+\-@\t\r]/.test(s) ? `'${s}` : (s ?? ''));
  return Papa.unparse(
    {
      fields: ['date', 'kind', 'order', 'amount', 'earned', 'paid_out', 'currency', 'memo'],
      data: entries.map((e) => [
        e.day,
        e.kind,
        e.orderNumber ?? '',
        minorToDecimal(e.amountMinor, digits),
        minorToDecimal(e.earnedMinor, digits),
        minorToDecimal(e.paidOutMinor, digits),
        e.currency,
        safe(e.memo),
      ]),
    },
    { newline: '\r\n' },
  );
}

export const monthOf = (ms: number, timeZone = 'UTC') => dayInZone(ms, timeZone).slice(0, 7);
