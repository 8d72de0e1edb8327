/**
 * Services throw these; HttpErrorFilter is the one place that turns them into status codes, so
 * services stay usable from the worker and the CLI where there is no HTTP.
 */
export interface FieldIssue {
  path: string;
  message: string;
}

export abstract class DomainError extends Error {
  abstract readonly statusCode: number;
}

export class NotFoundError extends DomainError {
  readonly statusCode = 404;
  constructor(what = 'Not found') {
    super(what);
  }
}

export class UnauthorizedError extends DomainError {
  readonly statusCode = 401;
  constructor(message = 'Sign-in required') {
    super(message);
  }
}

export class ForbiddenError extends DomainError {
  readonly statusCode = 403;
  constructor(message = 'Your role does not allow this') {
    super(message);
  }
}

/**
 * A 409. `code` names a conflict the client handles on its own (e.g. `replaces-better-timing`, which it
 * answers by asking the person and repeating the request), and `detail` carries what the client shows.
 */
export class ConflictError extends DomainError {
  readonly statusCode = 409;
  constructor(
    message: string,
    readonly code?: string,
    readonly detail?: unknown,
  ) {
    super(message);
  }
}

export class ValidationError extends DomainError {
  readonly statusCode = 400;
  constructor(readonly issues: FieldIssue[]) {
    super('Validation failed');
  }
}

export class TooManyRequestsError extends DomainError {
  readonly statusCode = 429;
  constructor(readonly retryAfterSeconds: number) {
    super('Too many failed sign-in attempts; try again later');
  }
}

/** A request body of a media type the route does not read (e.g. text/plain on a JSON route). */
export class UnsupportedMediaTypeError extends DomainError {
  readonly statusCode = 415;
}

/**
 * A request that repeats an earlier one's Idempotency-Key with another body: answering with the first
 * request's result would silently drop what this one asked for.
 */
export class UnprocessableError extends DomainError {
  readonly statusCode = 422;
}

export class UnavailableError extends DomainError {
  readonly statusCode = 503;
}
