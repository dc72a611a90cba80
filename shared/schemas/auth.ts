import { z } from 'zod';
import { isCommonPassword } from '../common-passwords.ts';

export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .min(1, 'Enter your e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.com.' }));

/** OWASP ASVS 6.2.1 (≥ 8), 6.2.9 (≥ 64 allowed; we allow 128), 6.2.4 (common passwords refused). */
export const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .min(8, 'Use at least 8 characters.')
  .max(128, 'Use at most 128 characters.')
  .refine((p) => !isCommonPassword(p), 'That password is too common. Choose another.');

export const nameSchema = z.string({ error: 'Enter your name.' }).trim().min(1, 'Enter your name.').max(80, 'Use at most 80 characters.');

export const signUpSchema = z.object({ name: nameSchema, email: emailSchema, password: newPasswordSchema });
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(128, 'Use at most 128 characters.'),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const requestResetSchema = z.object({ email: emailSchema });
export type RequestResetInput = z.infer<typeof requestResetSchema>;

export const resetPasswordSchema = z.object({ token: z.string().min(1, 'This reset link is incomplete.'), newPassword: newPasswordSchema });
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;

/** POST /api/auth/change-password: the new password follows the sign-up rules. */
export const changePasswordSchema = z
  .object({
    currentPassword: z.string({ error: 'Enter your current password.' }).min(1, 'Enter your current password.').max(128, 'Use at most 128 characters.'),
    newPassword: newPasswordSchema,
    revokeOtherSessions: z.boolean().optional(),
  })
  .refine((v) => v.newPassword !== v.currentPassword, { path: ['newPassword'], message: 'Choose a password different from the current one.' });
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

/**
 * POST /api/auth/update-user: only the name can be changed there. Anything else in the body (a
 * role, a ban flag, an e-mail, a password) is refused by name, never passed on.
 */
export const updateUserSchema = z
  .looseObject({ name: nameSchema.optional() })
  .superRefine((v, ctx) => {
    for (const key of Object.keys(v)) if (key !== 'name') ctx.addIssue({ code: 'custom', path: [key], message: 'This cannot be changed here.' });
  })
  .transform(({ name }) => (name === undefined ? {} : { name }));
export type UpdateUserInput = z.output<typeof updateUserSchema>;

/** The admin plugin's endpoints that set a password use the same rules (the endpoints are admin-only). */
export const adminSetUserPasswordSchema = z.object({ userId: z.string().min(1).max(64), newPassword: newPasswordSchema });
export const adminCreateUserSchema = z.object({ email: emailSchema, name: nameSchema, password: newPasswordSchema });

export const roleSchema = z.enum(['shopper', 'seller', 'admin']);
export type Role = z.infer<typeof roleSchema>;

export const shopStateSchema = z.enum(['in_review', 'live', 'suspended', 'rejected']);

export const meSchema = z.object({
  user: z.object({ id: z.string(), email: z.string(), name: z.string(), role: roleSchema }),
  shop: z.object({ id: z.string(), slug: z.string(), name: z.string(), state: shopStateSchema }).nullable(),
});
export type Me = z.infer<typeof meSchema>;

export const openShopSchema = z.object({
  name: z.string({ error: 'Enter a shop name.' }).trim().min(2, 'Use at least 2 characters.').max(60, 'Use at most 60 characters.'),
});
export type OpenShopInput = z.infer<typeof openShopSchema>;
