/** Materials: a shop's vinyl stock. Lengths mm, temperatures °C (shown °F too), money minor units. */
import { z } from 'zod';
import { defaultPressProfile, MATERIAL_KINDS, type MaterialKind, PRESS_DEFAULTS, type PressProfile } from '../engine/press-defaults.ts';
import { pageQuery } from './pagination.ts';

export type { MaterialKind, PressProfile };
export { defaultPressProfile, MATERIAL_KINDS, PRESS_DEFAULTS };

export const materialKindSchema = z.enum(MATERIAL_KINDS, { error: 'Pick smooth, glitter, flock, metallic or patterned.' });

/** Common roll widths: 305 mm (12 in) and 381 mm (15 in) (from memory); others allowed. */
export const COMMON_ROLL_WIDTHS_MM = [305, 381] as const;

// Press temperatures for HTV sit well inside 100–220 °C; outside that range is a typing mistake.
const press = z.object({
  tempC: z.number({ error: 'Enter a temperature in °C.' }).min(100, 'At least 100 °C (212 °F).').max(220, 'At most 220 °C (428 °F).'),
  timeS: z.number({ error: 'Enter a time in seconds.' }).min(1, 'At least 1 s.').max(120, 'At most 120 s.'),
});
export const pressProfileSchema = z.object({
  handheld: press,
  clamshell: press,
  tackS: z.number().min(0).max(60),
  peel: z.enum(['hot', 'warm', 'cold', 'hot or cold']),
  topOnly: z.boolean(),
  /** seconds to cool before a warm or cold peel; profiles saved before it was asked for have none */
  coolS: z.number({ error: 'Enter a time in seconds.' }).min(0, 'Cannot be negative.').max(120, 'At most 120 s.').optional(),
});

const fields = {
  kind: materialKindSchema,
  colourName: z.string({ error: 'Name the colour.' }).trim().min(1, 'Name the colour.').max(40, 'Use at most 40 characters.'),
  colourHex: z
    .string({ error: 'Enter a colour like #2f7d6d.' })
    .trim()
    .regex(/^#[0-9a-fA-F]{6}$/, 'Enter a colour like #2f7d6d.')
    .transform((s) => s.toLowerCase()),
  rollWidthMm: z.number({ error: 'Enter the roll width in mm.' }).min(50, 'At least 50 mm.').max(1600, 'At most 1600 mm.'),
  stockMm: z.number({ error: 'Enter the length in stock in mm.' }).min(0, 'Cannot be negative.').max(1_000_000, 'At most 1 km.'),
  lowStockMm: z.number().min(0).max(1_000_000),
  pricePerMetreMinor: z.number().int('Whole cents.').min(0).max(1_000_000),
  pressProfile: pressProfileSchema,
};

/** What a new material gets when the seller leaves these out (the form starts from them too). */
export const MATERIAL_DEFAULTS = { lowStockMm: 1000, pricePerMetreMinor: 0 } as const;

/** POST /api/materials: the press profile is optional and defaults to the kind's row in shared/engine/press-defaults.ts. */
export const createMaterialSchema = z
  .object({
    ...fields,
    lowStockMm: fields.lowStockMm.default(MATERIAL_DEFAULTS.lowStockMm),
    pricePerMetreMinor: fields.pricePerMetreMinor.default(MATERIAL_DEFAULTS.pricePerMetreMinor),
    pressProfile: fields.pressProfile.optional(),
  })
  .transform((m) => ({ ...m, pressProfile: m.pressProfile ?? defaultPressProfile(m.kind) }));
export type CreateMaterialInput = z.input<typeof createMaterialSchema>;

/** PATCH /api/materials/:id: any subset; `archived: true` hides it from new listings. */
export const updateMaterialSchema = z
  .object({ ...fields, archived: z.boolean() })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change.' });
export type UpdateMaterialInput = z.input<typeof updateMaterialSchema>;

export const materialIdParams = z.object({ id: z.string().min(1).max(64) });
/** GET /api/materials: the shop's materials by kind and colour, a page at a time; `archived` picks one side */
export const MATERIALS_PAGE_SIZE = 50;
export const materialsQuerySchema = pageQuery(MATERIALS_PAGE_SIZE).extend({ archived: z.enum(['true', 'false'], { error: 'Use archived=true or archived=false.' }).optional() });
export type MaterialsQuery = z.output<typeof materialsQuerySchema>;

export type Material = {
  id: string;
  kind: MaterialKind;
  colourName: string;
  colourHex: string;
  rollWidthMm: number;
  stockMm: number;
  lowStockMm: number;
  lowStock: boolean;
  pricePerMetreMinor: number;
  pressProfile: PressProfile;
  archived: boolean;
  createdAt: number;
};
