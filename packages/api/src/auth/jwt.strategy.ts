import { createSecretKey } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import { AppConfig } from '../config/app-config';
import { UserRepository } from '../users/user.repository';
import type { AuthUser } from './auth-user';

export interface AccessTokenClaims {
  sub: string;
}

@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy, 'jwt') {
  constructor(
    config: AppConfig,
    private readonly users: UserRepository,
  ) {
    // jsonwebtoken turns a string or Buffer secret into a key on every verify, first trying it as a PEM
    // public key (and failing): a tenth of a read request's time. A KeyObject made once skips both.
    // passport-jwt hands the provider's value straight to jsonwebtoken; its types predate KeyObject.
    const key = createSecretKey(Buffer.from(config.jwtSecret, 'utf8'));
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      secretOrKeyProvider: (_request: unknown, _token: unknown, done: (error: null, key: Buffer) => void) =>
        done(null, key as unknown as Buffer),
      algorithms: ['HS256'],
      ignoreExpiration: false,
    });
  }

  /** Reads the user row on every request so that a removed user or a revoked admin flag acts at once. */
  async validate(claims: AccessTokenClaims): Promise<AuthUser | false> {
    if (typeof claims.sub !== 'string') return false;
    return (await this.users.findAuthUser(claims.sub)) ?? false;
  }
}
