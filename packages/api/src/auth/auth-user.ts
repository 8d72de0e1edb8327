import { createParamDecorator, type ExecutionContext } from '@nestjs/common';
import type { Request } from 'express';
import { UnauthorizedError } from '../common/domain-errors';

/** What JwtStrategy puts on the request once the access token and the user row check out. */
export interface AuthUser {
  id: string;
  email: string;
  isAdmin: boolean;
}

export function isAuthUser(value: unknown): value is AuthUser {
  return typeof value === 'object' && value !== null && 'id' in value && typeof value.id === 'string';
}

export function authUserOf(request: Request): AuthUser | null {
  return isAuthUser(request.user) ? request.user : null;
}

export const CurrentUser = createParamDecorator((_data: unknown, ctx: ExecutionContext): AuthUser => {
  const user = authUserOf(ctx.switchToHttp().getRequest<Request>());
  if (!user) throw new UnauthorizedError();
  return user;
});
