import { meViewSchema } from '@limbus/schema';
import { z } from 'zod';
import { TEAM_ROLES } from '../roles';

/** Response shapes, for the OpenAPI document; the services' TypeScript types are the same shapes. */
export const TeamSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  roles: z.array(z.enum(TEAM_ROLES)),
});

export const SessionViewSchema = z.object({
  accessToken: z.string().describe('JWT (HS256) for the Authorization: Bearer header'),
  user: meViewSchema,
});
