import { ArgumentsHost, Catch, ExceptionFilter, HttpException, HttpStatus, Logger } from '@nestjs/common';
import type { Response } from 'express';
import {
  ConflictError,
  DomainError,
  type FieldIssue,
  TooManyRequestsError,
  UnavailableError,
  ValidationError,
} from './domain-errors';

export interface ErrorBody {
  statusCode: number;
  error: string;
  message: string;
  issues?: FieldIssue[];
  /** A conflict the client handles by name, with what it shows (see ConflictError). */
  code?: string;
  detail?: unknown;
}

/** Reason phrases by code, taken from Nest's own HttpStatus names (e.g. NOT_FOUND -> "Not Found"). */
function reasonPhrase(statusCode: number): string {
  const name = HttpStatus[statusCode];
  if (typeof name !== 'string') return 'Error';
  return name
    .toLowerCase()
    .split('_')
    .map((w) => w.charAt(0).toUpperCase() + w.slice(1))
    .join(' ');
}

function messageOf(exception: HttpException): string {
  const body = exception.getResponse();
  if (typeof body === 'string') return body;
  if (typeof body === 'object' && body !== null && 'message' in body) {
    const message = body.message;
    if (typeof message === 'string') return message;
    if (Array.isArray(message)) return message.map(String).join('; ');
  }
  return exception.message;
}

/** Errors raised by Express middleware (body-parser) carry their status this way. */
function isHttpLikeError(value: unknown): value is { status: number; message: string; expose?: boolean } {
  return (
    typeof value === 'object' &&
    value !== null &&
    'status' in value &&
    typeof value.status === 'number' &&
    'message' in value &&
    typeof value.message === 'string'
  );
}

/**
 * Codes of the mariadb connector (its `lib/misc/errors.js` and `lib/const/error-code.js`) and Node's
 * socket errors that mean "no usable connection to the database", as opposed to a bad query.
 */
const UNREACHABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
  'ER_CONNECTION_ALREADY_CLOSED',
  'ER_SOCKET_UNEXPECTED_CLOSE',
  'ER_CMD_CONNECTION_CLOSED',
  'ER_CONNECTION_TIMEOUT',
  'ER_SOCKET_TIMEOUT',
  'ER_SOCKET',
  'ER_GET_CONNECTION_TIMEOUT',
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
]);

/**
 * The database (or the way to it) is down: the request may succeed later, so it is a 503, not a 500.
 * SQLSTATE class 08 is "connection exception" in ISO/IEC 9075 (MariaDB sends 08S01 for a lost link);
 * knex names a pool that found no connection in time KnexTimeoutError. MikroORM copies the driver's
 * code and SQLSTATE onto its own exceptions, and a wrapped error keeps the original as `cause`.
 */
export function isDatabaseUnavailable(error: unknown, depth = 0): boolean {
  if (typeof error !== 'object' || error === null || depth > 3) return false;
  const { code, sqlState, name, cause } = error as Record<string, unknown>;
  if (typeof code === 'string' && UNREACHABLE_CODES.has(code)) return true;
  if (typeof sqlState === 'string' && sqlState.startsWith('08')) return true;
  if (name === 'KnexTimeoutError') return true;
  return isDatabaseUnavailable(cause, depth + 1);
}

export function toErrorBody(exception: unknown): ErrorBody {
  if (exception instanceof ValidationError) {
    return {
      statusCode: 400,
      error: reasonPhrase(400),
      message: exception.message,
      issues: exception.issues,
    };
  }
  if (exception instanceof ConflictError && exception.code !== undefined) {
    return {
      statusCode: 409,
      error: reasonPhrase(409),
      message: exception.message,
      code: exception.code,
      ...(exception.detail === undefined ? {} : { detail: exception.detail }),
    };
  }
  if (exception instanceof DomainError) {
    return {
      statusCode: exception.statusCode,
      error: reasonPhrase(exception.statusCode),
      message: exception.message,
    };
  }
  if (exception instanceof HttpException) {
    const statusCode = exception.getStatus();
    const message = messageOf(exception);
    // Nest's router says "Cannot GET /api/x"; answer in our words without echoing the path.
    if (statusCode === 404 && /^Cannot [A-Z]+ /.test(message)) {
      return { statusCode, error: reasonPhrase(statusCode), message: 'No such route' };
    }
    return { statusCode, error: reasonPhrase(statusCode), message };
  }
  if (isHttpLikeError(exception) && exception.status >= 400 && exception.status < 500) {
    return {
      statusCode: exception.status,
      error: reasonPhrase(exception.status),
      message: exception.message,
    };
  }
  if (isDatabaseUnavailable(exception))
    return toErrorBody(new UnavailableError('The database is unavailable; try again shortly'));
  return { statusCode: 500, error: reasonPhrase(500), message: 'Internal server error' };
}

/** The single mapping from thrown errors to JSON responses; never sends a stack trace. */
@Catch()
export class HttpErrorFilter implements ExceptionFilter {
  private readonly logger = new Logger('HttpErrorFilter');

  catch(exception: unknown, host: ArgumentsHost): void {
    const body = toErrorBody(exception);
    if (body.statusCode >= 500) {
      this.logger.error(
        exception instanceof Error ? (exception.stack ?? exception.message) : String(exception),
      );
    }
    if (host.getType() !== 'http') return;
    const response = host.switchToHttp().getResponse<Response>();
    if (exception instanceof TooManyRequestsError) {
      response.setHeader('Retry-After', String(exception.retryAfterSeconds));
    }
    response.status(body.statusCode).json(body);
  }
}
