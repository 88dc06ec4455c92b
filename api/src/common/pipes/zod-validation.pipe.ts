import { BadRequestException, Injectable, type PipeTransform } from '@nestjs/common';
import type { ApiError } from '@keyloom/shared';
import type { z } from 'zod';

export const INVALID_BODY_MESSAGE = 'Check the highlighted fields.';

/** Field problems in the shape of apiErrorSchema's `issues` (dotted paths, '' for the whole body). */
export function toIssues(error: z.ZodError): NonNullable<ApiError['issues']> {
  return error.issues.map((issue) => ({
    path: issue.path.map(String).join('.'),
    message:
      issue.path.length === 0 && issue.code === 'invalid_type'
        ? 'Send a JSON object as the request body.'
        : issue.message,
  }));
}

/** Parses `value` with `schema`, or throws a 400 listing each field's problem. */
export function parseOrThrow<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  throw new BadRequestException({ message: INVALID_BODY_MESSAGE, issues: toIssues(result.error) });
}

/**
 * Validates a body/query with a shared zod schema: `@Body(new ZodValidationPipe(createUserSchema))`.
 * Unknown keys are dropped (zod's default), so a client cannot slip in fields such as passwordHash.
 */
@Injectable()
export class ZodValidationPipe<S extends z.ZodType> implements PipeTransform<unknown, z.output<S>> {
  constructor(private readonly schema: S) {}

  transform(value: unknown): z.output<S> {
    return parseOrThrow(this.schema, value);
  }
}
