import { z } from 'zod';
import { FONT_IDS } from '../engine/font-catalog.ts';

import { MAX_LETTER_HEIGHT_MM, MAX_TEXT_CHARS, MIN_LETTER_HEIGHT_MM } from '../engine/limits.ts';

/** Most characters a text field accepts over the API (code points, after NFC), and the letter heights. */
export { MAX_LETTER_HEIGHT_MM, MAX_TEXT_CHARS, MIN_LETTER_HEIGHT_MM };

export const fontIdSchema = z.enum(FONT_IDS, { error: 'Choose one of the fonts offered.' });

export const layoutTextRequestSchema = z.object({
  text: z
    .string({ error: 'Enter the text.' })
    .transform((s) => s.normalize('NFC'))
    .refine((s) => s.trim().length > 0, 'Enter the text.')
    .refine((s) => [...s].length <= MAX_TEXT_CHARS, `Use at most ${MAX_TEXT_CHARS} characters.`)
    .refine((s) => !/[\p{Cc}\p{Cs}]/u.test(s.replace(/[\t ]/g, '')), 'The text has control characters.'),
  fontId: fontIdSchema,
  letterHeightMm: z
    .number({ error: 'Give the letter height in millimetres.' })
    .finite()
    .min(MIN_LETTER_HEIGHT_MM, `The letter height must be between ${MIN_LETTER_HEIGHT_MM} and ${MAX_LETTER_HEIGHT_MM} mm.`)
    .max(MAX_LETTER_HEIGHT_MM, `The letter height must be between ${MIN_LETTER_HEIGHT_MM} and ${MAX_LETTER_HEIGHT_MM} mm.`),
  trackingMm: z.number().finite().min(-20, 'Tracking must be between −20 and 50 mm.').max(50, 'Tracking must be between −20 and 50 mm.').optional(),
});
export type LayoutTextRequest = z.infer<typeof layoutTextRequestSchema>;

export const textWarningSchema = z.object({
  code: z.enum(['below_min_letter_height', 'too_long', 'missing_characters', 'extra_spaces', 'mixed_case']),
  message: z.string(),
  characters: z.array(z.string()).optional(),
  letterHeightMm: z.number().optional(),
  minLetterHeightMm: z.number().optional(),
});

export const layoutTextResponseSchema = z.object({
  text: z.string(),
  fontId: z.string(),
  letterHeightMm: z.number(),
  widthMm: z.number(),
  heightMm: z.number(),
  advanceMm: z.number(),
  bboxMm: z.object({ minX: z.number(), minY: z.number(), maxX: z.number(), maxY: z.number() }),
  path: z.string(),
  glyphs: z.array(z.object({ char: z.string(), advanceMm: z.number() })),
  missing: z.array(z.string()),
  warnings: z.array(textWarningSchema),
});
export type LayoutTextResponse = z.infer<typeof layoutTextResponseSchema>;

export const fontInfoSchema = z.object({
  id: z.string(),
  family: z.string(),
  kind: z.enum(['script', 'print']),
  style: z.string(),
  licence: z.string(),
  fileUrl: z.string(),
  characters: z.string(),
  minLetterHeightMm: z.number(),
});
export const fontListSchema = z.array(fontInfoSchema);
export type FontInfo = z.infer<typeof fontInfoSchema>;

export const fontParamsSchema = z.object({ id: fontIdSchema });
