import { randomUUID } from 'node:crypto';
import { IsolationLevel, LockMode } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { Inject, Injectable, Logger } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { Redis } from 'ioredis';
import { NotFoundError, UnauthorizedError, UnavailableError } from '../common/domain-errors';
import { isLockConflict, retryOnLockConflict } from '../common/lock-retry';
import { newOpaqueToken, sha256Hex } from '../common/tokens';
import { AppConfig } from '../config/app-config';
import { escapeHtml, MailService } from '../mail/mail.service';
import { REDIS } from '../redis/redis.module';
import { type MeView, TeamsService } from '../teams/teams.service';
import { User } from '../users/entities/user.entity';
import { PasswordService } from '../users/password.service';
import { UserRepository } from '../users/user.repository';
import { PasswordResetToken } from './entities/password-reset-token.entity';
import { RefreshToken } from './entities/refresh-token.entity';
import type { AccessTokenClaims } from './jwt.strategy';
import { LoginRateLimiter } from './login-rate-limiter';
import { RedisFailureCounterStore } from './redis-failure-counter.store';
import { ResetRequestThrottle } from './reset-request-throttle';

export interface Session {
  accessToken: string;
  /** Raw refresh token for the cookie; only its hash is stored. */
  refreshToken: string;
  user: MeView;
}

const WRONG_CREDENTIALS = 'Wrong e-mail or password';
const SESSION_ENDED = 'Session ended';
const RESET_TOKEN_TTL_SECONDS = 3600;
const RESET_LINK_GONE = 'This reset link is unknown, used or expired';

/**
 * The token tables are written by short transactions that lock rows only, never the gaps between
 * index entries (READ COMMITTED takes no gap locks), so two requests of different users or families
 * cannot deadlock over neighbouring index entries; what still meets is retried (retryOnLockConflict).
 */
const TOKEN_TRANSACTION = { isolationLevel: IsolationLevel.READ_COMMITTED };

@Injectable()
export class AuthService {
  private readonly logger = new Logger(AuthService.name);
  private readonly limiter: LoginRateLimiter;
  private readonly resetThrottle: ResetRequestThrottle;

  constructor(
    private readonly config: AppConfig,
    private readonly em: EntityManager,
    private readonly users: UserRepository,
    private readonly passwords: PasswordService,
    private readonly jwt: JwtService,
    private readonly teams: TeamsService,
    private readonly mail: MailService,
    @Inject(REDIS) redis: Redis,
  ) {
    const counters = new RedisFailureCounterStore(redis);
    this.limiter = new LoginRateLimiter(counters, {
      perAccount: config.loginFailureLimit,
      perAddress: config.loginFailureAddressLimit,
      windowSeconds: config.loginFailureWindowSeconds,
    });
    this.resetThrottle = new ResetRequestThrottle(counters);
  }

  async login(email: string, password: string, clientAddress: string): Promise<Session> {
    const user = await this.users.findByEmail(email);
    const ok = await this.checkPassword(email, user, password, clientAddress);
    if (!user || !ok) throw new UnauthorizedError(WRONG_CREDENTIALS);
    return this.startSession(user);
  }

  /**
   * Checks a password under the sign-in limiter (429 with Retry-After once the account or the client
   * address has too many failures). Sign-in and accepting an invitation with an existing account share
   * the counters, so neither is a way around the other. An unknown account still costs one argon2
   * verification, so timing does not tell which accounts exist.
   */
  async checkPassword(
    email: string,
    user: User | null,
    password: string,
    clientAddress: string,
  ): Promise<boolean> {
    await this.limiter.assertAllowed(email, clientAddress);
    const ok = user
      ? await this.passwords.verify(user.passwordHash, password)
      : await this.passwords.burn(password).then(() => false);
    if (!ok) {
      await this.limiter.recordFailure(email, clientAddress);
      return false;
    }
    await this.limiter.recordSuccess(email);
    return true;
  }

  /** Issues an access token and the first refresh token of a new family: sign-in and invitation accept. */
  async startSession(user: User): Promise<Session> {
    const refreshToken = newOpaqueToken();
    this.em.persist(new RefreshToken(user, sha256Hex(refreshToken), this.refreshExpiry(), randomUUID()));
    await this.em.flush();
    return this.session(user.id, refreshToken);
  }

  /**
   * Rotates: the presented token is revoked and a new one of the same family issued. The revocation is
   * one conditional update (`… where id = ? and revoked_at is null`) whose affected-row count decides:
   * of several requests with one token, exactly one changes the row and wins. The winner's new token is
   * inserted in the same transaction, and a loser's update waits on the winner's row lock, so by the time
   * a loser learns it lost, the winner's new token is committed and the loser's revocation of the family
   * reaches it. A token shown after it was rotated means it was copied (or sent twice at once): its whole
   * family ends, the winner's new token included.
   */
  async refresh(rawToken: string | null): Promise<Session> {
    if (!rawToken) throw new UnauthorizedError('No session');
    const row = await this.em
      .fork()
      .findOne(
        RefreshToken,
        { tokenHash: sha256Hex(rawToken) },
        { fields: ['user', 'familyId', 'revokedAt', 'expiresAt'] },
      );
    if (!row) throw new UnauthorizedError('No session');
    if (row.revokedAt !== null) {
      await this.endFamily(row.familyId);
      throw new UnauthorizedError(SESSION_ENDED);
    }
    if (row.expiresAt.getTime() <= Date.now()) throw new UnauthorizedError('Session expired');
    let next: string | null;
    try {
      next = await retryOnLockConflict(() => this.rotate(row.id, row.user.id, row.familyId));
    } catch (error) {
      // Still meeting other requests after the retries: the client signs in again rather than seeing a 500.
      if (!isLockConflict(error)) throw error;
      this.logger.warn(`refresh of family ${row.familyId} gave up after repeated lock conflicts`);
      throw new UnauthorizedError(SESSION_ENDED);
    }
    if (next === null) {
      await this.endFamily(row.familyId);
      throw new UnauthorizedError(SESSION_ENDED);
    }
    return this.session(row.user.id, next);
  }

  async logout(rawToken: string | null): Promise<void> {
    if (!rawToken) return;
    await this.em
      .fork()
      .nativeUpdate(
        RefreshToken,
        { tokenHash: sha256Hex(rawToken), revokedAt: null },
        { revokedAt: new Date() },
      );
  }

  /**
   * Always answers the same, at once: the throttle counts every request alike (Redis, both paths), and
   * looking the address up, storing the link and sending the mail happen after the answer. So neither the
   * answer nor its timing tells whether the account exists. A throttled request sends nothing.
   */
  async requestPasswordReset(email: string, clientAddress: string): Promise<void> {
    if (!(await this.resetThrottle.admit(email, clientAddress))) return;
    void this.sendResetLink(email);
  }

  /**
   * Using a link ends every other link of the account too. The user row is locked first, as issuing does,
   * so a use and an issue of one account never interleave; the link is taken by a conditional update, so of
   * two uses of one link only one sets the password.
   */
  async confirmPasswordReset(token: string, password: string): Promise<void> {
    const row = await this.em
      .fork()
      .findOne(
        PasswordResetToken,
        { tokenHash: sha256Hex(token) },
        { fields: ['user', 'usedAt', 'expiresAt'] },
      );
    if (!row || row.usedAt !== null || row.expiresAt.getTime() <= Date.now()) {
      throw new NotFoundError(RESET_LINK_GONE);
    }
    const passwordHash = await this.passwords.hash(password);
    const userId = row.user.id;
    const user = await retryOnLockConflict(() =>
      this.em.fork().transactional(async (em) => {
        const owner = await em.findOne(User, { id: userId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
        if (!owner) return null;
        const now = new Date();
        const taken = await em.nativeUpdate(
          PasswordResetToken,
          { id: row.id, usedAt: null, expiresAt: { $gt: now } },
          { usedAt: now },
        );
        if (taken === 0) return null;
        await em.nativeDelete(PasswordResetToken, { user: userId, usedAt: null });
        owner.passwordHash = passwordHash;
        return owner;
      }, TOKEN_TRANSACTION),
    );
    if (!user) throw new NotFoundError(RESET_LINK_GONE);
    // A reset usually follows a suspected compromise: end every existing session.
    try {
      await this.endSessions({ column: 'user_id', value: user.id });
    } catch (error) {
      if (!isLockConflict(error)) throw error;
      throw new UnavailableError(
        'The new password is set, but the other sessions could not be ended just now: ask for another reset link to end them',
      );
    }
    await this.limiter.recordSuccess(user.email);
  }

  /** Runs after the 202; a failure is logged and the person may ask again. */
  private async sendResetLink(email: string): Promise<void> {
    try {
      const token = newOpaqueToken();
      const user = await retryOnLockConflict(() =>
        this.em.fork().transactional(async (em) => {
          const owner = await em.findOne(
            User,
            { email: email.toLowerCase() },
            { lockMode: LockMode.PESSIMISTIC_WRITE },
          );
          if (!owner) return null;
          // A new link ends the earlier ones, so only the newest e-mail works.
          await em.nativeDelete(PasswordResetToken, { user: owner.id, usedAt: null });
          em.persist(
            new PasswordResetToken(
              owner,
              sha256Hex(token),
              new Date(Date.now() + RESET_TOKEN_TTL_SECONDS * 1000),
            ),
          );
          return owner;
        }, TOKEN_TRANSACTION),
      );
      if (!user) return;
      const link = this.mail.link(`/reset-password/${token}`);
      await this.mail.send({
        to: user.email,
        subject: 'Reset your Limbus password',
        kind: 'password-reset',
        text: `Someone asked to reset the password of your Limbus account.\n\nChoose a new password here (valid for one hour; it replaces any earlier link):\n${link}\n\nIf it was not you, ignore this message.`,
        html: `<p>Someone asked to reset the password of your Limbus account.</p><p><a href="${escapeHtml(link)}">Choose a new password</a> (valid for one hour; it replaces any earlier link).</p><p>If it was not you, ignore this message.</p>`,
      });
    } catch (error) {
      this.logger.warn(
        `password-reset link not sent: ${error instanceof Error ? error.message : String(error)}`,
      );
    }
  }

  /** The winner's new raw token, or null when another request had already rotated (or revoked) this one. */
  private rotate(tokenId: string, userId: string, familyId: string): Promise<string | null> {
    return this.em.fork().transactional(async (em) => {
      const won = await em.nativeUpdate(
        RefreshToken,
        { id: tokenId, revokedAt: null },
        { revokedAt: new Date() },
      );
      if (won === 0) return null;
      const token = newOpaqueToken();
      em.persist(
        new RefreshToken(em.getReference(User, userId), sha256Hex(token), this.refreshExpiry(), familyId),
      );
      return token;
    }, TOKEN_TRANSACTION);
  }

  /** A family revocation still failing after the retries is logged: the loser answers 401 all the same. */
  private async endFamily(familyId: string): Promise<void> {
    try {
      await this.endSessions({ column: 'family_id', value: familyId });
    } catch (error) {
      if (!isLockConflict(error)) throw error;
      this.logger.error(`revoking refresh-token family ${familyId} failed after repeated lock conflicts`);
    }
  }

  /**
   * Revokes every token of a family or a user, keeping the revocation time of those already revoked. The
   * statement names one indexed column only (no `revoked_at is null`), so it always walks that index.
   */
  private async endSessions(which: { column: 'family_id' | 'user_id'; value: string }): Promise<void> {
    await retryOnLockConflict(() =>
      this.em.fork().transactional(async (em) => {
        await em
          .getConnection()
          .execute(
            `update \`refresh_tokens\` set \`revoked_at\` = coalesce(\`revoked_at\`, ?) where \`${which.column}\` = ?`,
            [new Date(), which.value],
            'run',
            em.getTransactionContext(),
          );
      }, TOKEN_TRANSACTION),
    );
  }

  private refreshExpiry(): Date {
    return new Date(Date.now() + this.config.refreshTokenTtlSeconds * 1000);
  }

  private async session(userId: string, refreshToken: string): Promise<Session> {
    const claims: AccessTokenClaims = { sub: userId };
    const accessToken = await this.jwt.signAsync(claims, { expiresIn: this.config.accessTokenTtlSeconds });
    return { accessToken, refreshToken, user: await this.teams.me(userId) };
  }
}
