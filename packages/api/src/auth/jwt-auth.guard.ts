import { type ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Observable } from 'rxjs';
import { AuthGuard } from '@nestjs/passport';
import { UnauthorizedError } from '../common/domain-errors';
import { IS_PUBLIC } from './public.decorator';

/** Global guard: every route needs a bearer access token unless marked @Public(). */
@Injectable()
export class JwtAuthGuard extends AuthGuard('jwt') {
  constructor(private readonly reflector: Reflector) {
    super();
  }

  override canActivate(context: ExecutionContext): boolean | Promise<boolean> | Observable<boolean> {
    const isPublic = this.reflector.getAllAndOverride<boolean | undefined>(IS_PUBLIC, [
      context.getHandler(),
      context.getClass(),
    ]);
    if (isPublic) return true;
    return super.canActivate(context);
  }

  override handleRequest<TUser>(error: unknown, user: TUser | false): TUser {
    // An error here is the user lookup failing (e.g. the database is down), not a bad token: the error
    // filter answers it (503), so a client is not signed out by an outage.
    if (error instanceof Error) throw error;
    if (error || !user) throw new UnauthorizedError('Sign-in required or session expired');
    return user;
  }
}
