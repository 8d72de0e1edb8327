import { EntityManager } from '@mikro-orm/mariadb';
import { Inject, Injectable } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { Redis } from 'ioredis';
import { UnauthorizedError, NotFoundError } from '../common/domain-errors';
import { newOpaqueToken, sha256Hex } from '../common/tokens';
import { AppConfig } from '../config/app-config';
import { escapeHtml, MailService } from '../mail/mail.service';
import { REDIS } from '../redis/redis.module';
import { type MeView, TeamsService } from '../teams/teams.service';
import type { User } from '../users/entities/user.entity';
import { PasswordService } from '../users/password.service';
import { UserRepository } from '../users/user.repository';
import { PasswordResetToken } from './entities/password-reset-token.entity';
import { RefreshToken } from './entities/refresh-token.entity';
import type { AccessTokenClaims } from './jwt.strategy';
import { LoginRateLimiter } from './login-rate-limiter';
import { RedisFailureCounterStore } from './redis-failure-counter.store';

export interface Session {
  accessToken: string;
  /** Raw refresh token for the cookie; only its hash is stored. */
  refreshToken: string;
  user: MeView;
}

const WRONG_CREDENTIALS = 'Wrong e-mail or password';
const RESET_TOKEN_TTL_SECONDS = 3600;

@Injectable()
export class AuthService {
  private readonly limiter: LoginRateLimiter;

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
    this.limiter = new LoginRateLimiter(new RedisFailureCounterStore(redis), {
      perAccount: config.loginFailureLimit,
      perAddress: config.loginFailureAddressLimit,
      windowSeconds: config.loginFailureWindowSeconds,
    });
  }

  async login(email: string, password: string, clientAddress: string): Promise<Session> {
    await this.limiter.assertAllowed(email, clientAddress);
    const user = await this.users.findByEmail(email);
    const ok = user
      ? await this.passwords.verify(user.passwordHash, password)
      : await this.passwords.burn(password);
    if (!user || !ok) {
      await this.limiter.recordFailure(email, clientAddress);
      throw new UnauthorizedError(WRONG_CREDENTIALS);
    }
    await this.limiter.recordSuccess(email);
    return this.startSession(user);
  }

  /** Issues an access token and a new refresh token row; used by sign-in, refresh and invitation accept. */
  async startSession(user: User): Promise<Session> {
    const refreshToken = newOpaqueToken();
    const expiresAt = new Date(Date.now() + this.config.refreshTokenTtlSeconds * 1000);
    this.em.persist(new RefreshToken(user, sha256Hex(refreshToken), expiresAt));
    await this.em.flush();
    const claims: AccessTokenClaims = { sub: user.id };
    const accessToken = await this.jwt.signAsync(claims, { expiresIn: this.config.accessTokenTtlSeconds });
    return { accessToken, refreshToken, user: await this.teams.me(user.id) };
  }

  /**
   * Rotates: the presented token is revoked and a new one issued. A token presented after it was
   * revoked means someone kept a copy, so all of that user's sessions end.
   */
  async refresh(rawToken: string | null): Promise<Session> {
    if (!rawToken) throw new UnauthorizedError('No session');
    const row = await this.em.findOne(
      RefreshToken,
      { tokenHash: sha256Hex(rawToken) },
      { populate: ['user'] },
    );
    if (!row) throw new UnauthorizedError('No session');
    if (row.revokedAt !== null) {
      await this.revokeAll(row.user.id);
      throw new UnauthorizedError('Session ended');
    }
    if (row.expiresAt.getTime() <= Date.now()) throw new UnauthorizedError('Session expired');
    row.revokedAt = new Date();
    return this.startSession(row.user);
  }

  async logout(rawToken: string | null): Promise<void> {
    if (!rawToken) return;
    const row = await this.em.findOne(RefreshToken, { tokenHash: sha256Hex(rawToken), revokedAt: null });
    if (!row) return;
    row.revokedAt = new Date();
    await this.em.flush();
  }

  /** Answers the same whether or not the account exists, so the form cannot probe for accounts. */
  async requestPasswordReset(email: string): Promise<void> {
    const user = await this.users.findByEmail(email);
    if (!user) return;
    const token = newOpaqueToken();
    this.em.persist(
      new PasswordResetToken(user, sha256Hex(token), new Date(Date.now() + RESET_TOKEN_TTL_SECONDS * 1000)),
    );
    await this.em.flush();
    const link = this.mail.link(`/reset-password/${token}`);
    await this.mail.send({
      to: user.email,
      subject: 'Reset your Limbus password',
      kind: 'password-reset',
      text: `Someone asked to reset the password of your Limbus account.\n\nChoose a new password here (valid for one hour):\n${link}\n\nIf it was not you, ignore this message.`,
      html: `<p>Someone asked to reset the password of your Limbus account.</p><p><a href="${escapeHtml(link)}">Choose a new password</a> (valid for one hour).</p><p>If it was not you, ignore this message.</p>`,
    });
  }

  async confirmPasswordReset(token: string, password: string): Promise<void> {
    const row = await this.em.findOne(
      PasswordResetToken,
      { tokenHash: sha256Hex(token) },
      { populate: ['user'] },
    );
    if (!row || row.usedAt !== null || row.expiresAt.getTime() <= Date.now()) {
      throw new NotFoundError('This reset link is unknown, used or expired');
    }
    row.usedAt = new Date();
    row.user.passwordHash = await this.passwords.hash(password);
    await this.em.flush();
    // A reset usually follows a suspected compromise: end every existing session.
    await this.revokeAll(row.user.id);
    await this.limiter.recordSuccess(row.user.email);
  }

  private async revokeAll(userId: string): Promise<void> {
    await this.em.nativeUpdate(RefreshToken, { user: userId, revokedAt: null }, { revokedAt: new Date() });
  }
}
