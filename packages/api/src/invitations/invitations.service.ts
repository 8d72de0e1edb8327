import { EntityManager, UniqueConstraintViolationException } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { InvitationView, PublicInvitationView } from '@limbus/schema';
import { AuthService, type Session } from '../auth/auth.service';
import {
  ConflictError,
  NotFoundError,
  UnauthorizedError,
  UnavailableError,
  ValidationError,
} from '../common/domain-errors';
import { newOpaqueToken, sha256Hex } from '../common/tokens';
import { escapeHtml, MailService, utcText } from '../mail/mail.service';
import { Membership } from '../teams/entities/membership.entity';
import { Team } from '../teams/entities/team.entity';
import type { TeamRole } from '../teams/roles';
import { User } from '../users/entities/user.entity';
import { PasswordService } from '../users/password.service';
import { UserRepository } from '../users/user.repository';
import { Invitation } from './entities/invitation.entity';

export type { InvitationView, PublicInvitationView };

const INVITATION_TTL_SECONDS = 7 * 24 * 3600;

/** The columns keep whole seconds; so do the answers and e-mails that show these times. */
const wholeSecondsFromNow = (seconds = 0): Date => new Date((Math.floor(Date.now() / 1000) + seconds) * 1000);
const newExpiry = (): Date => wholeSecondsFromNow(INVITATION_TTL_SECONDS);

/** "observer", "coordinator and observer", "coordinator, modeller and observer". */
function rolesText(roles: readonly TeamRole[]): string {
  if (roles.length <= 1) return roles.join('');
  return `${roles.slice(0, -1).join(', ')} and ${roles.at(-1)}`;
}

function invitationView(invitation: Invitation): InvitationView {
  return {
    id: invitation.id,
    email: invitation.email,
    roles: invitation.roles,
    invitedBy: { id: invitation.invitedBy.id, name: invitation.invitedBy.name },
    createdAt: invitation.createdAt.toISOString(),
    lastSentAt: invitation.lastSentAt.toISOString(),
    expiresAt: invitation.expiresAt.toISOString(),
    expired: invitation.expiresAt.getTime() <= Date.now(),
  };
}

function alreadyInvited(invitation: Invitation): ConflictError {
  return new ConflictError(
    `${invitation.email} was already invited on ${utcText(invitation.lastSentAt)}: resend it instead`,
  );
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

  /** The team's open invitations (neither accepted nor revoked), newest first; expired ones included. */
  async list(teamId: string): Promise<InvitationView[]> {
    const rows = await this.em.find(
      Invitation,
      { team: teamId, acceptedAt: null, revokedAt: null },
      { populate: ['invitedBy'], orderBy: { createdAt: 'desc', id: 'asc' } },
    );
    return rows.map(invitationView);
  }

  /**
   * One open invitation per address and team. The check before the insert gives the friendly answer;
   * the unique key (team_id, open_email) decides when two requests race past it. An expired open
   * invitation is revoked and replaced.
   */
  async invite(teamId: string, email: string, roles: TeamRole[], inviterId: string): Promise<{ id: string }> {
    const team = await this.em.findOneOrFail(Team, { id: teamId });
    const inviter = await this.em.findOneOrFail(User, { id: inviterId });
    await this.assertNotMember(teamId, email);
    const token = newOpaqueToken();
    const invitation = new Invitation(team, email, roles, sha256Hex(token), inviter, newExpiry());
    try {
      await this.em.transactional(async (em) => {
        const open = await em.findOne(Invitation, { team: teamId, openEmail: invitation.email });
        if (open) {
          if (open.expiresAt.getTime() > Date.now()) throw alreadyInvited(open);
          open.revokedAt = new Date();
          open.openEmail = null;
          // Flushed on its own: the new row may take the unique key only once this one gave it up.
          await em.flush();
        }
        em.persist(invitation);
        await em.flush();
      });
    } catch (error) {
      if (!(error instanceof UniqueConstraintViolationException)) throw error;
      const winner = await this.em.fork().findOne(Invitation, { team: teamId, openEmail: invitation.email });
      throw winner
        ? alreadyInvited(winner)
        : new ConflictError(`${invitation.email} is being invited right now: reload the team page`);
    }
    await this.sendInvitation(invitation, team, inviter, token);
    return { id: invitation.id };
  }

  /** A new token and expiry: the link of the earlier e-mail stops working. */
  async resend(teamId: string, invitationId: string, senderId: string): Promise<InvitationView> {
    const invitation = await this.openOfTeam(teamId, invitationId);
    await this.assertNotMember(teamId, invitation.email);
    const sender = await this.em.findOneOrFail(User, { id: senderId });
    const token = newOpaqueToken();
    invitation.tokenHash = sha256Hex(token);
    invitation.expiresAt = newExpiry();
    invitation.lastSentAt = wholeSecondsFromNow();
    await this.em.flush();
    await this.sendInvitation(invitation, invitation.team, sender, token);
    return invitationView(invitation);
  }

  /** The link stops working and the address may be invited again. */
  async revoke(teamId: string, invitationId: string): Promise<void> {
    const invitation = await this.openOfTeam(teamId, invitationId);
    invitation.revokedAt = new Date();
    invitation.openEmail = null;
    await this.em.flush();
  }

  async describe(token: string): Promise<PublicInvitationView> {
    const invitation = await this.open(token);
    return {
      email: invitation.email,
      teamName: invitation.team.name,
      roles: invitation.roles,
      role: invitation.roles[0] ?? 'observer',
      expiresAt: invitation.expiresAt.toISOString(),
      existingAccount: (await this.users.findByEmail(invitation.email)) !== null,
    };
  }

  /**
   * A new address gets an account with the given name and password; an existing account must
   * prove it owns the address by its current password, and then gains every role of the invitation.
   * That password check is the sign-in's, under the same limiter (429 with Retry-After), so the
   * invitation is no way around the limit on guessing passwords.
   */
  async accept(
    token: string,
    name: string | undefined,
    password: string,
    clientAddress: string,
  ): Promise<Session> {
    const invitation = await this.open(token);
    let user = await this.users.findByEmail(invitation.email);
    if (user) {
      if (!(await this.auth.checkPassword(invitation.email, user, password, clientAddress))) {
        throw new UnauthorizedError('This address already has an account: enter its current password');
      }
    } else {
      if (name === undefined)
        throw new ValidationError([{ path: 'name', message: 'a new account needs your name' }]);
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

  private async assertNotMember(teamId: string, email: string): Promise<void> {
    const user = await this.users.findByEmail(email);
    if (!user) return;
    const membership = await this.em.findOne(Membership, { team: teamId, user });
    if (!membership) return;
    throw new ConflictError(
      `${user.email} is already a member of this team (roles ${membership.roles.join(', ')}): change their roles on the team page`,
    );
  }

  /** An invitation of another team answers like a missing one. */
  private async openOfTeam(teamId: string, invitationId: string): Promise<Invitation> {
    const invitation = await this.em.findOne(
      Invitation,
      { id: invitationId, team: teamId, acceptedAt: null, revokedAt: null },
      { populate: ['team', 'invitedBy'] },
    );
    if (!invitation) throw new NotFoundError('No such open invitation in this team');
    return invitation;
  }

  /** Unknown, used, revoked, resent and expired tokens look alike to the caller. */
  private async open(token: string): Promise<Invitation> {
    const invitation = await this.em.findOne(
      Invitation,
      { tokenHash: sha256Hex(token) },
      { populate: ['team'] },
    );
    if (
      !invitation ||
      invitation.acceptedAt !== null ||
      invitation.revokedAt !== null ||
      invitation.expiresAt.getTime() <= Date.now()
    ) {
      throw new NotFoundError('This invitation is unknown, used or expired');
    }
    return invitation;
  }

  /** The invitation is stored before this runs; a mail server failure says so instead of a 500. */
  private async sendInvitation(
    invitation: Invitation,
    team: Team,
    sender: User,
    token: string,
  ): Promise<void> {
    const link = this.mail.link(`/invitations/${token}`);
    const roles = rolesText(invitation.roles);
    const until = utcText(invitation.expiresAt);
    try {
      await this.mail.send({
        to: invitation.email,
        subject: `You are invited to ${team.name} on Limbus`,
        kind: 'invitation',
        text: `${sender.name} invites you to join ${team.name} on Limbus as ${roles}.\n\nAccept here (valid until ${until}):\n${link}\n`,
        html: `<p>${escapeHtml(sender.name)} invites you to join <strong>${escapeHtml(team.name)}</strong> on Limbus as ${escapeHtml(roles)}.</p><p><a href="${escapeHtml(link)}">Accept the invitation</a> (valid until ${escapeHtml(until)}).</p>`,
      });
    } catch {
      throw new UnavailableError(
        `The invitation to ${invitation.email} is saved but its e-mail could not be sent: resend it later`,
      );
    }
  }
}
