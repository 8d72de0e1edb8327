import { type CanActivate, type ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { DECORATORS } from '@nestjs/swagger';
import type { Request } from 'express';
import { UnsupportedMediaTypeError } from './domain-errors';

const JSON_TYPE = 'application/json';

/** The media type of a Content-Type header, lower-case and without parameters ("" when absent). */
export function mediaTypeOf(header: string | undefined): string {
  return (header ?? '').split(';')[0]?.trim().toLowerCase() ?? '';
}

/** Whether a request carries a body at all (RFC 9112 section 6.3: a length above zero, or chunked). */
export function hasBody(req: Pick<Request, 'headers'>): boolean {
  if (req.headers['transfer-encoding'] !== undefined) return true;
  const length = Number(req.headers['content-length'] ?? 0);
  return Number.isFinite(length) && length > 0;
}

/** Whether `mediaType` is one the route takes; a route taking JSON also takes `application/<x>+json`. */
export function acceptsMediaType(accepted: readonly string[], mediaType: string): boolean {
  return accepted.some(
    (type) =>
      type === mediaType ||
      (type === JSON_TYPE && mediaType.startsWith('application/') && mediaType.endsWith('+json')),
  );
}

/**
 * A body of a type the route does not read answers 415 naming that type, instead of reaching the route
 * unparsed (where it read as a missing body: "expected object, received undefined"). Routes take JSON
 * unless they say otherwise with `@ApiConsumes(...)` (the uploads say `multipart/form-data`), the same
 * declaration the OpenAPI document shows. A guard rather than an interceptor: a global interceptor would
 * wrap every handler in an observable, and the progress stream would then send its headers (200) before
 * its ticket check could answer 401. Registered before the token guard, so it answers first.
 */
@Injectable()
export class ContentTypeGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    if (context.getType() === 'http') {
      const req = context.switchToHttp().getRequest<Request>();
      if (hasBody(req)) {
        const accepted = this.reflector.getAllAndOverride<string[] | undefined>(DECORATORS.API_CONSUMES, [
          context.getHandler(),
          context.getClass(),
        ]) ?? [JSON_TYPE];
        const mediaType = mediaTypeOf(req.headers['content-type']);
        if (!acceptsMediaType(accepted, mediaType)) {
          const given = mediaType === '' ? 'a body without Content-Type' : `Content-Type ${mediaType}`;
          throw new UnsupportedMediaTypeError(`${given} is not accepted here: send ${accepted.join(' or ')}`);
        }
      }
    }
    return true;
  }
}
