import { z } from 'zod';
import { newPasswordSchema, passwordChangeInputSchema } from './auth';

/**
 * Form-only shapes the app needs beside the request DTOs in auth.ts / groups.ts (which stay the one
 * definition of what the server accepts). Nothing here is sent to the server as it is.
 */

/** Reset form: the new password typed twice; only `password` goes to the server. */
export const resetPasswordFormSchema = z
  .object({
    password: newPasswordSchema,
    confirmPassword: z.string({ error: 'Type the new password again.' }).min(1, 'Type the new password again.'),
  })
  .refine((value) => value.password === value.confirmPassword, {
    path: ['confirmPassword'],
    message: 'The two passwords differ: type the same one twice.',
  });
export type ResetPasswordForm = z.infer<typeof resetPasswordFormSchema>;

/** Change-password form (signed in): current, new, new again; the first two go to the server. */
export const changePasswordFormSchema = passwordChangeInputSchema
  .extend({
    confirmPassword: z.string({ error: 'Type the new password again.' }).min(1, 'Type the new password again.'),
  })
  .refine((value) => value.newPassword === value.confirmPassword, {
    path: ['confirmPassword'],
    message: 'The two passwords differ: type the same one twice.',
  });
export type ChangePasswordForm = z.infer<typeof changePasswordFormSchema>;

/** GET /api/dev/outbox (development only): the app only needs to know the local mail sink answers. */
export const devOutboxResponseSchema = z.object({ messages: z.array(z.unknown()) });
export type DevOutboxResponse = z.infer<typeof devOutboxResponseSchema>;
