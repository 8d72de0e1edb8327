import type { z } from 'zod';
import { ApiError } from '@/lib/api-client';

export type FieldErrors = Record<string, string>;

/** First message per top-level field, from a failed client-side parse. */
export function fieldErrorsFromZod(error: z.ZodError): FieldErrors {
  const errors: FieldErrors = {};
  for (const issue of error.issues) {
    const key = String(issue.path[0] ?? '');
    errors[key] ??= issue.message;
  }
  return errors;
}

/** The server names fields by JSON path ("password", "body.password"); the last segment is the field. */
export function fieldErrorsFromApi(error: unknown): FieldErrors {
  const errors: FieldErrors = {};
  if (!(error instanceof ApiError)) return errors;
  for (const issue of error.issues) {
    const key = issue.path.split('.').pop() ?? issue.path;
    errors[key] ??= issue.message;
  }
  return errors;
}

export function errorMessage(error: unknown): string {
  if (error instanceof Error) return error.message;
  return 'Something went wrong';
}
