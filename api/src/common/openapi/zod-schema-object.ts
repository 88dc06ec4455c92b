import type { SchemaObject } from '@nestjs/swagger';
import { z } from 'zod';

/** A shared zod schema as an OpenAPI schema object, so /api/docs shows the real request bodies. */
export function zodSchemaObject(schema: z.ZodType): SchemaObject {
  const json: Record<string, unknown> = {
    ...z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }),
  };
  delete json.$schema; // OpenAPI 3.0 schema objects have no $schema
  return json;
}
