import { z } from 'zod';

/** Long enough to resist guessing, short enough to hash quickly; common practice, no source. */
export const PasswordSchema = z.string().min(10, 'must be at least 10 characters').max(200);
const EmailSchema = z.email().max(254);

export const LoginSchema = z.object({ email: EmailSchema, password: z.string().min(1).max(200) }).strict();
export type LoginDto = z.infer<typeof LoginSchema>;

export const PasswordResetRequestSchema = z.object({ email: EmailSchema }).strict();
export type PasswordResetRequestDto = z.infer<typeof PasswordResetRequestSchema>;

export const PasswordResetConfirmSchema = z
  .object({ token: z.string().min(1).max(200), password: PasswordSchema })
  .strict();
export type PasswordResetConfirmDto = z.infer<typeof PasswordResetConfirmSchema>;
