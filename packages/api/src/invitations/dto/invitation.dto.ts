import { z } from 'zod';
import { PasswordSchema } from '../../auth/dto/auth.dto';
import { TEAM_ROLES } from '../../teams/roles';

export const CreateInvitationSchema = z
  .object({ email: z.email().max(254), role: z.enum(TEAM_ROLES) })
  .strict();
export type CreateInvitationDto = z.infer<typeof CreateInvitationSchema>;

export const AcceptInvitationSchema = z
  .object({ name: z.string().trim().min(1).max(200), password: PasswordSchema })
  .strict();
export type AcceptInvitationDto = z.infer<typeof AcceptInvitationSchema>;
