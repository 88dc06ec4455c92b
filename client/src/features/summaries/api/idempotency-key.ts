import { useCallback, useRef } from 'react';

/**
 * The Idempotency-Key header for one action (IETF HTTPAPI draft "The Idempotency-Key HTTP Header
 * Field", draft-ietf-httpapi-idempotency-key-header): a structured-field string (RFC 8941), so the
 * UUID goes in double quotes.
 */
export const idempotencyHeader = (key: string): Record<string, string> => ({ 'Idempotency-Key': `"${key}"` });

/**
 * One idempotency key per send action: `keyFor(request)` gives the same key while the same request
 * is tried again (after an error or a lost answer, so the server sends at most once) and a fresh one
 * (crypto.randomUUID) for a different request; `done()` after success, so the next action is new.
 */
export const useIdempotencyKey = () => {
  const current = useRef<{ request: string; key: string } | null>(null);
  const keyFor = useCallback((request: unknown): string => {
    const text = JSON.stringify(request);
    if (current.current?.request !== text) current.current = { request: text, key: crypto.randomUUID() };
    return current.current.key;
  }, []);
  const done = useCallback(() => {
    current.current = null;
  }, []);
  return { keyFor, done };
};
