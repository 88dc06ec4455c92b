import { BadRequestException, createParamDecorator, type ExecutionContext } from '@nestjs/common';
import type { Request } from 'express';

// The Idempotency-Key request header (IETF HTTPAPI draft "The Idempotency-Key HTTP Header Field",
// draft-ietf-httpapi-idempotency-key-header, "Syntax"): an Item Structured Field (RFC 8941) whose value is
// a String, e.g. Idempotency-Key: "8e03978e-40d5-43e8-bc93-6894a57f9324". A bare value without the
// quotes is accepted as well (common practice, no source). Keys longer than 255 characters are
// refused (common practice, no source): a UUID is 36.

export const IDEMPOTENCY_KEY_HEADER = 'Idempotency-Key';
export const MAX_IDEMPOTENCY_KEY_LENGTH = 255;
export const BAD_IDEMPOTENCY_KEY_MESSAGE =
  `The ${IDEMPOTENCY_KEY_HEADER} header must be a quoted string of 1 to ${MAX_IDEMPOTENCY_KEY_LENGTH} ` +
  'printable characters, for example "8e03978e-40d5-43e8-bc93-6894a57f9324".';

const PRINTABLE = /^[\x20-\x7e]+$/;
const BARE = /^[\x21-\x7e]+$/;

/**
 * The key in an Idempotency-Key header value; undefined when there is no header; null when the value
 * is not a valid key. A quoted value follows RFC 8941 §3.3.3 (backslash escapes only `"` and `\`).
 */
export function parseIdempotencyKey(raw: string | string[] | undefined): string | null | undefined {
  if (raw === undefined) return undefined;
  if (Array.isArray(raw)) return raw.length === 1 ? parseIdempotencyKey(raw[0]) : null;
  const value = raw.trim();
  let key: string;
  if (value.startsWith('"')) {
    if (value.length < 2 || !value.endsWith('"')) return null;
    key = '';
    const inner = value.slice(1, -1);
    for (let i = 0; i < inner.length; i++) {
      const c = inner[i];
      if (c === '"') return null;
      if (c === '\\') {
        const next = inner[i + 1];
        if (next !== '"' && next !== '\\') return null;
        key += next;
        i++;
      } else key += c;
    }
    if (!PRINTABLE.test(key)) return null;
  } else {
    if (!BARE.test(value) || value.includes('"')) return null;
    key = value;
  }
  return key.length >= 1 && key.length <= MAX_IDEMPOTENCY_KEY_LENGTH ? key : null;
}

/** The request's idempotency key (undefined when none was sent); 400 for a malformed one. */
export const IdempotencyKeyHeader = createParamDecorator(
  (_data: unknown, ctx: ExecutionContext): string | undefined => {
    const request = ctx.switchToHttp().getRequest<Request>();
    const key = parseIdempotencyKey(request.headers[IDEMPOTENCY_KEY_HEADER.toLowerCase()]);
    if (key === null) throw new BadRequestException(BAD_IDEMPOTENCY_KEY_MESSAGE);
    return key;
  },
);
