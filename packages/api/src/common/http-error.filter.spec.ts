import { BadRequestException, NotFoundException, PayloadTooLargeException } from '@nestjs/common';
import { describe, expect, it } from 'vitest';
import {
  ConflictError,
  ForbiddenError,
  NotFoundError,
  TooManyRequestsError,
  ValidationError,
} from './domain-errors';
import { toErrorBody } from './http-error.filter';

describe('toErrorBody', () => {
  it('toErrorBody() maps each domain error to its status and reason phrase', () => {
    expect(toErrorBody(new NotFoundError())).toEqual({
      statusCode: 404,
      error: 'Not Found',
      message: 'Not found',
    });
    expect(toErrorBody(new ForbiddenError())).toEqual({
      statusCode: 403,
      error: 'Forbidden',
      message: 'Your role does not allow this',
    });
    expect(toErrorBody(new ConflictError('Already there'))).toEqual({
      statusCode: 409,
      error: 'Conflict',
      message: 'Already there',
    });
    expect(toErrorBody(new TooManyRequestsError(30)).statusCode).toBe(429);
    expect(toErrorBody(new TooManyRequestsError(30)).error).toBe('Too Many Requests');
  });

  it('toErrorBody() keeps the field issues of a validation error', () => {
    const body = toErrorBody(new ValidationError([{ path: 'stations.0.latDeg', message: 'too large' }]));
    expect(body).toEqual({
      statusCode: 400,
      error: 'Bad Request',
      message: 'Validation failed',
      issues: [{ path: 'stations.0.latDeg', message: 'too large' }],
    });
  });

  it('toErrorBody() sends the code and detail of a named conflict, and neither for a plain one', () => {
    const detail = { chordId: 'c1', current: { disappearance: null } };
    expect(
      toErrorBody(new ConflictError('would replace timed values', 'replaces-better-timing', detail)),
    ).toEqual({
      statusCode: 409,
      error: 'Conflict',
      message: 'would replace timed values',
      code: 'replaces-better-timing',
      detail: { chordId: 'c1', current: { disappearance: null } },
    });
    expect(toErrorBody(new ConflictError('taken', 'name-taken'))).toEqual({
      statusCode: 409,
      error: 'Conflict',
      message: 'taken',
      code: 'name-taken',
    });
    expect(toErrorBody(new ConflictError('Already there'))).not.toHaveProperty('code');
  });

  it('toErrorBody() words an unknown route without echoing it, but keeps other 404 messages', () => {
    expect(toErrorBody(new NotFoundException('Cannot GET /api/<script>')).message).toBe('No such route');
    expect(toErrorBody(new NotFoundException('Event not found')).message).toBe('Event not found');
  });

  it('toErrorBody() passes on HttpException and body-parser statuses', () => {
    expect(toErrorBody(new BadRequestException('bad')).message).toBe('bad');
    expect(toErrorBody(new PayloadTooLargeException()).statusCode).toBe(413);
    const parserError = Object.assign(new SyntaxError('Unexpected end of JSON input'), { status: 400 });
    expect(toErrorBody(parserError)).toEqual({
      statusCode: 400,
      error: 'Bad Request',
      message: 'Unexpected end of JSON input',
    });
  });

  it('toErrorBody() answers 503 when the database cannot be reached, and 500 for other database errors', () => {
    const unavailable = {
      statusCode: 503,
      error: 'Service Unavailable',
      message: 'The database is unavailable; try again shortly',
    };
    // What the mariadb connector threw while the fault test had MariaDB stopped (code, errno, SQLSTATE).
    const refused = Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:33061'), {
      code: 'ECONNREFUSED',
      errno: -111,
      sqlState: 'HY000',
    });
    expect(toErrorBody(refused)).toEqual(unavailable);
    const closed = Object.assign(new Error('socket has unexpectedly been closed'), {
      code: 'ER_SOCKET_UNEXPECTED_CLOSE',
      sqlState: '08S01',
    });
    expect(toErrorBody(new Error('select failed', { cause: closed }))).toEqual(unavailable);
    expect(toErrorBody(Object.assign(new Error('lost'), { sqlState: '08S01' }))).toEqual(unavailable);
    expect(toErrorBody(Object.assign(new Error('Knex: Timeout'), { name: 'KnexTimeoutError' }))).toEqual(
      unavailable,
    );
    const duplicate = Object.assign(new Error('Duplicate entry'), {
      code: 'ER_DUP_ENTRY',
      sqlState: '23000',
    });
    expect(toErrorBody(duplicate).statusCode).toBe(500);
  });

  it('toErrorBody() hides the message and stack of an unexpected error', () => {
    const body = toErrorBody(new Error('connect ECONNREFUSED 10.0.0.5:3306 password=hunter2'));
    expect(body).toEqual({
      statusCode: 500,
      error: 'Internal Server Error',
      message: 'Internal server error',
    });
  });
});
