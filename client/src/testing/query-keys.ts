import { hashKey, partialMatchKey, type QueryKey } from '@tanstack/react-query';
import { expect } from 'vitest';

/**
 * Checks a feature's query-key factory (TanStack Query's query key factory, docs/references.md §6):
 * - every key lies under the feature's `all` prefix, matched the way `invalidateQueries({ queryKey })`
 *   matches (TanStack's own `partialMatchKey`), so invalidating `all` still reaches it;
 * - no two named keys hash alike (two resources would otherwise share one cache entry).
 */
export const expectKeyFactory = (all: QueryKey, keys: Record<string, QueryKey>): void => {
  const seen = new Map<string, string>();
  for (const [name, key] of Object.entries(keys)) {
    expect(partialMatchKey(key, all), `${name} ${JSON.stringify(key)} under ${JSON.stringify(all)}`).toBe(
      true,
    );
    const hash = hashKey(key);
    expect(seen.get(hash), `${name} equals ${seen.get(hash) ?? ''}: ${hash}`).toBeUndefined();
    seen.set(hash, name);
  }
};

/** Whether `invalidateQueries({ queryKey: prefix })` would reach a query with `key`. */
export const isUnder = (key: QueryKey, prefix: QueryKey): boolean => partialMatchKey(key, prefix);
