import { ArgumentsHost, Catch, ExceptionFilter, HttpException, HttpStatus, Logger } from '@nestjs/common';
import type { Response } from 'express';
import {
  ConflictError,
  DomainError,
  type FieldIssue,
  TooManyRequestsError,
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
