/** Shop settings and states (the seller's own shop). The public shop page is in catalog.ts. */
import { z } from 'zod';

export const SHOP_STATES = ['in_review', 'live', 'suspended', 'rejected'] as const;
export type ShopState = (typeof SHOP_STATES)[number];

export const shopSlugSchema = z
  .string({ error: 'Enter a web address for the shop.' })
  .trim()
  .toLowerCase()
  .regex(/^[a-z0-9](?:[a-z0-9-]{0,58}[a-z0-9])?$/, 'Use 1–60 lower-case letters, digits and dashes, not starting or ending with a dash.');

export const shopSettingsSchema = z
  .object({
    name: z.string({ error: 'Enter a shop name.' }).trim().min(2, 'Use at least 2 characters.').max(60, 'Use at most 60 characters.'),
    slug: shopSlugSchema,
    description: z.string().trim().max(2000, 'Use at most 2,000 characters.'),
    /** an upload id from POST /api/uploads (kind logo), or null to remove */
    logoId: z.string().max(64).nullable(),
    processingDays: z.number({ error: 'Enter the processing days.' }).int('Whole days.').min(1, 'At least 1 day.').max(60, 'At most 60 days.'),
    shippingMinor: z.number({ error: 'Enter the shipping price.' }).int('Whole cents.').min(0, 'Cannot be negative.').max(100_000, 'That is too much.'),
    returnPolicy: z.string().trim().max(2000, 'Use at most 2,000 characters.'),
    pressType: z.enum(['handheld', 'clamshell']),
    /** press every item once more from the back after the final press */
    backPress: z.boolean(),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change.' });
export type ShopSettingsInput = z.input<typeof shopSettingsSchema>;

export const shopSlugParams = z.object({ slug: z.string().min(1).max(80) });

/** GET/PATCH /api/shop */
export type OwnShop = {
  id: string;
  name: string;
  slug: string;
  description: string;
  state: ShopState;
  stateReason: string | null;
  currency: string;
  processingDays: number;
  shippingMinor: number;
  returnPolicy: string;
  pressType: 'handheld' | 'clamshell';
  backPress: boolean;
  logoUrl: string | null;
  /**
   * A new name/description of an approved shop, waiting for moderation (`name`/`description` above
   * stay the approved, public ones until then); only the changed fields are present.
   */
  pendingChange: { name?: string; description?: string; submittedAt: number } | null;
  /** why the last name/description change was not approved */
  changeRejectionReason: string | null;
};
