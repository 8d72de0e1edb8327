import { PipeTransform } from '@nestjs/common';
import { z } from 'zod';
import { ValidationError } from './domain-errors';

/** Validates a body against a zod schema; issues carry the JSON path, e.g. "email" or "roles.0". */
export class ZodValidationPipe<S extends z.ZodType> implements PipeTransform<unknown, z.infer<S>> {
  constructor(private readonly schema: S) {}

  transform(value: unknown): z.infer<S> {
    const result = this.schema.safeParse(value);
    if (result.success) return result.data;
    throw new ValidationError(
      result.error.issues.map((issue) => ({
        path: issue.path.length > 0 ? issue.path.map(String).join('.') : '(body)',
        message: issue.message,
      })),
    );
  }
}

/** OpenAPI body schema from the same zod schema the pipe uses, so docs and checks cannot drift. */
export function openApiSchema(schema: z.ZodType): Record<string, unknown> {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, { io: 'input' });
  return rest;
}
