import { PasswordResetToken } from '../auth/entities/password-reset-token.entity';
import { RefreshToken } from '../auth/entities/refresh-token.entity';
import { Invitation } from '../invitations/entities/invitation.entity';
import { Membership } from '../teams/entities/membership.entity';
import { Team } from '../teams/entities/team.entity';
import { User } from '../users/entities/user.entity';

/**
 * Listed by hand: folder globs do not work once vitest or a bundler loads the code.
 * Feature modules added later append their entities here.
 */
export const ENTITIES = [User, Team, Membership, Invitation, RefreshToken, PasswordResetToken];
