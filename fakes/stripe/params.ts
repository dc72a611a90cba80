// Parameter schemas shared by the resource modules, and `validate`, which turns the first zod issue
// into Stripe's 400 naming the parameter in bracket form (`line_items[0][quantity]`).
import { z } from 'zod';
import { invalid } from './http.ts';

export const intStr = z.string().regex(/^-?\d+$/, 'expected an integer');
export const nonNegInt = intStr.transform(Number).pipe(z.number().int().min(0));
export const posInt = intStr.transform(Number).pipe(z.number().int().min(1));
export const currency = z
  .string()
  .regex(/^[a-zA-Z]{3}$/, 'expected a three-letter ISO currency code')
  .transform((s) => s.toLowerCase());
export const metadata = z
  .record(z.string().max(40, 'metadata keys are at most 40 characters'), z.string().max(500, 'metadata values are at most 500 characters'))
  .refine((m) => Object.keys(m).length <= 50, 'at most 50 metadata keys');
export const email = z
  .string()
  .max(512)
  .regex(/^[^\s@]+@[^\s@]+\.[^\s@]+$/, 'expected an e-mail address');
export const expandList = z.array(z.string()).optional();

/** Paging parameters every list endpoint takes. */
export const listQuery = {
  limit: intStr.transform(Number).pipe(z.number().int().min(1).max(100)).optional(),
  starting_after: z.string().optional(),
  ending_before: z.string().optional(),
  expand: expandList,
};
export const listSchema = z.object(listQuery);
export type ListQuery = z.output<typeof listSchema>;

/** A retrieve takes `expand[]` only. */
export const retrieveSchema = z.object({ expand: expandList });

function getAt(raw: unknown, p: PropertyKey[]): unknown {
  let cur: unknown = raw;
  for (const k of p) {
    if (cur === null || typeof cur !== 'object') return undefined;
    cur = (cur as Record<PropertyKey, unknown>)[k];
  }
  return cur;
}

/** The parsed parameters, or a 400 `parameter_missing` / `parameter_invalid` naming the first bad one. */
export function validate<S extends z.ZodType>(schema: S, raw: unknown): z.output<S> {
  const r = schema.safeParse(raw);
  if (r.success) return r.data;
  const issue = r.error.issues[0]!;
  const segs = issue.path.map(String);
  const param = segs.length
    ? segs[0] +
      segs
        .slice(1)
        .map((s) => `[${s}]`)
        .join('')
    : '';
  const absent = segs.length > 0 && getAt(raw, issue.path) === undefined;
  throw invalid(absent ? `Missing required param: ${param}.` : `Invalid ${param || 'request'}: ${issue.message}`, {
    code: absent ? 'parameter_missing' : 'parameter_invalid',
    ...(param ? { param } : {}),
  });
}
