import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { AuthService, type Session } from '../auth/auth.service';
import { NotFoundError, UnauthorizedError } from '../common/domain-errors';
import { newOpaqueToken, sha256Hex } from '../common/tokens';
import { escapeHtml, MailService } from '../mail/mail.service';
import { Membership } from '../teams/entities/membership.entity';
import { Team } from '../teams/entities/team.entity';
import type { TeamRole } from '../teams/roles';
import { User } from '../users/entities/user.entity';
import { PasswordService } from '../users/password.service';
import { UserRepository } from '../users/user.repository';
import { Invitation } from './entities/invitation.entity';

const INVITATION_TTL_SECONDS = 7 * 24 * 3600;

export interface InvitationView {
  email: string;
  teamName: string;
  role: TeamRole;
  expiresAt: string;
}

@Injectable()
export class InvitationsService {
  constructor(
    private readonly em: EntityManager,
    private readonly users: UserRepository,
    private readonly passwords: PasswordService,
    private readonly mail: MailService,
    private readonly auth: AuthService,
  ) {}

  async invite(teamId: string, email: string, roles: TeamRole[], inviterId: string): Promise<{ id: string }> {
    const team = await this.em.findOneOrFail(Team, { id: teamId });
    const inviter = await this.em.findOneOrFail(User, { id: inviterId });
    const token = newOpaqueToken();
    const expiresAt = new Date(Date.now() + INVITATION_TTL_SECONDS * 1000);
    const invitation = new Invitation(team, email, roles, sha256Hex(token), inviter, expiresAt);
    const role = invitation.roles.join(', ');
    await this.em.persist(invitation).flush();

    const link = this.mail.link(`/invitations/${token}`);
    await this.mail.send({
      to: invitation.email,
      subject: `You are invited to ${team.name} on Limbus`,
      kind: 'invitation',
      text: `${inviter.name} invites you to join ${team.name} on Limbus as ${role}.\n\nAccept here (valid for 7 days):\n${link}\n`,
      html: `<p>${escapeHtml(inviter.name)} invites you to join <strong>${escapeHtml(team.name)}</strong> on Limbus as ${role}.</p><p><a href="${escapeHtml(link)}">Accept the invitation</a> (valid for 7 days).</p>`,
    });
    return { id: invitation.id };
  }

  async describe(token: string): Promise<InvitationView> {
    const invitation = await this.open(token);
    return {
      email: invitation.email,
      teamName: invitation.team.name,
      role: invitation.roles[0] ?? 'observer',
      expiresAt: invitation.expiresAt.toISOString(),
    };
  }

  /**
   * A new address gets an account with the given name and password; an existing account must
   * prove it owns the address by its current password, and then gains the role in the team.
   */
  async accept(token: string, name: string, password: string): Promise<Session> {
    const invitation = await this.open(token);
    let user = await this.users.findByEmail(invitation.email);
    if (user) {
      if (!(await this.passwords.verify(user.passwordHash, password))) {
        throw new UnauthorizedError('This address already has an account: enter its current password');
      }
    } else {
      user = new User(invitation.email, name, await this.passwords.hash(password));
      this.em.persist(user);
    }
    const membership = await this.em.findOne(Membership, { team: invitation.team, user });
    if (membership) for (const role of invitation.roles) membership.addRole(role);
    else this.em.persist(new Membership(invitation.team, user, invitation.roles));
    invitation.acceptedAt = new Date();
    invitation.openEmail = null;
    await this.em.flush();
    return this.auth.startSession(user);
  }

  /** Unknown, used and expired tokens look alike to the caller. */
  private async open(token: string): Promise<Invitation> {
    const invitation = await this.em.findOne(
      Invitation,
      { tokenHash: sha256Hex(token) },
      { populate: ['team'] },
    );
    if (!invitation || invitation.acceptedAt !== null || invitation.expiresAt.getTime() <= Date.now()) {
      throw new NotFoundError('This invitation is unknown, used or expired');
    }
    return invitation;
  }
}
