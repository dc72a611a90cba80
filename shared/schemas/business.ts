/** The seller's business view: working calendar, due lines, costs, price check, ledger, charts. */
import { z } from 'zod';
import type { CostTotals, LineCost, PriceCheck } from '../business/costs.ts';
import { type WeedingRates, weedingRatesSchema } from '../business/labour.ts';
import type { LedgerEntry, MonthBalance } from '../business/ledger.ts';
import type { ShipMark } from '../business/marks.ts';
import type { NeedMark } from '../business/needed-by.ts';
import type { ListingRow, VinylMonthRow, WeekRow } from '../business/reports.ts';
import { isValidDay } from '../business/working-days.ts';
import { listingInputSchema } from './listing.ts';

const day = z.string({ error: 'Enter a date.' }).refine(isValidDay, 'Use a real date, written yyyy-mm-dd.');

export const businessSettingsSchema = z
  .object({
    workingDays: z
      .array(z.number().int().min(1, 'Weekdays are 1 (Monday) to 7 (Sunday).').max(7, 'Weekdays are 1 (Monday) to 7 (Sunday).'))
      .min(1, 'Pick at least one working day.')
      .max(7)
      .transform((d) => [...new Set(d)].sort((a, b) => a - b)),
    daysOff: z
      .array(day)
      .max(200, 'At most 200 days off.')
      .transform((d) => [...new Set(d)].sort()),
    hourlyRateMinor: z.number({ error: 'Enter an hourly rate.' }).int('Whole cents.').min(0, 'Cannot be negative.').max(1_000_000, 'That is too much.'),
    /** the rates the weeding minutes are estimated at (shared/business/labour.ts) */
    weedingRates: weedingRatesSchema,
    processingDays: z.number({ error: 'Enter the processing days.' }).int('Whole days.').min(1, 'At least 1 day.').max(60, 'At most 60 days.'),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change.' });
export type BusinessSettingsInput = z.input<typeof businessSettingsSchema>;

export type BusinessSettings = {
  workingDays: number[];
  daysOff: string[];
  hourlyRateMinor: number;
  weedingRates: WeedingRates;
  processingDays: number;
  currency: string;
  timeZone: string;
  fees: { platformFeeBps: number; paymentFeeBps: number; paymentFeeFixedMinor: number };
};

export const dueQuerySchema = z.object({ today: day.optional() });

/** GET /api/business/due: open lines with their ship-by date and mark, most urgent first. */
export type DueLine = {
  lineId: string;
  orderId: string;
  orderNumber: string;
  listingTitle: string;
  quantity: number;
  state: string;
  shipBy: string | null;
  mark: ShipMark | null;
  /** working days left until the ship-by date (negative when late) */
  workingDaysLeft: number | null;
  /** the shopper's needed-by date; shipBy above is then the earlier of the shop's date and the last day to post in time */
  neededBy?: string | null;
  needMark?: NeedMark | null;
};
export type DueView = { today: string; lines: DueLine[] };

export const orderIdParams = z.object({ orderId: z.string().min(1).max(64) });

export type LineCostView = LineCost & { listingTitle: string; quantity: number; state: string };
export type OrderCostView = { orderId: string; orderNumber: string; currency: string; lines: LineCostView[]; totals: CostTotals };
export type CostsView = { currency: string; orders: OrderCostView[]; totals: CostTotals };

/** POST /api/business/price-check: the editor's current values (only the parts that cost) and a sample name. */
export const priceCheckSchema = z.object({
  draft: listingInputSchema.pick({ blank: true, basePriceMinor: true, extraLayerPriceMinor: true, personalisation: true, blankCostMinor: true, minutesPerLayer: true }),
  sampleName: z.string().trim().max(40, 'Use at most 40 characters.').default(''),
});
export type PriceCheckInput = z.input<typeof priceCheckSchema>;
export type PriceCheckResult = {
  currency: string;
  sample: PriceCheck & { name: string };
  longest: (PriceCheck & { name: string }) | null;
  warnings: string[];
};

export const ledgerQuerySchema = z
  .object({ from: day.optional(), to: day.optional() })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: 'The start date is after the end date.', path: ['from'] });
export type LedgerQuery = z.infer<typeof ledgerQuerySchema>;
export type LedgerView = { currency: string; entries: LedgerEntry[]; months: MonthBalance[] };

export type ChartsView = { currency: string; weeks: WeekRow[]; vinyl: VinylMonthRow[]; listings: ListingRow[] };
