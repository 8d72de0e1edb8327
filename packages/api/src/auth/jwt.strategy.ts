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
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      secretOrKey: config.jwtSecret,
      algorithms: ['HS256'],
      ignoreExpiration: false,
    });
  }

  /** Reads the user row on every request so that a removed user or a revoked admin flag acts at once. */
  async validate(claims: AccessTokenClaims): Promise<AuthUser | false> {
    if (typeof claims.sub !== 'string') return false;
    const user = await this.users.findOne({ id: claims.sub });
    return user ? { id: user.id, email: user.email, isAdmin: user.isAdmin } : false;
  }
}
