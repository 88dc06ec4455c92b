import { ConflictException, Injectable, UnprocessableEntityException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { createHash } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { IdempotencyKey } from './idempotency-key.entity';

// Exactly-once handling of a state-changing request that carries an Idempotency-Key, after the IETF
// HTTPAPI draft "The Idempotency-Key HTTP Header Field" (draft-ietf-httpapi-idempotency-key-header):
// - the first request with a key claims it (a row unique on user and key) and acts; the row is
//   marked done with the id of what it made IN THE SAME TRANSACTION as the change, so "done" and
//   "made" cannot part, across processes;
// - a repeat with the same key and the same request answers the first request's result (the
//   draft's "Idempotency Enforcement Scenarios");
// - the same key with another request: 422; while the first is still running: 409 (its "Error
//   Scenarios");
// - a first request that fails leaves nothing behind, so the same key may be tried again.
// Keys are kept for a day (the draft leaves the expiry to the server, "Idempotency Key Validity and
// Expiry"; the day is common practice, no source); a claim left pending for 5 minutes (its process
// died) may be taken over (common practice, no source).

export const KEY_IN_FLIGHT_MESSAGE =
  'A request with this Idempotency-Key is still being processed. Wait a moment, then look at the result.';
export const KEY_REUSED_MESSAGE =
  'This Idempotency-Key was already used for a different request. Use a new key for a new request.';

const KEEP_HOURS = 24;
const ABANDONED_AFTER_SECONDS = 300;

/** Marks the claimed key done, inside the transaction that makes `resourceId`. */
export type FinishIdempotent = (manager: EntityManager, resourceId: string) => Promise<void>;

/** What a request is, for comparing a repeat with the first: the route and its validated body. */
export type IdempotentRequest = { route: string; body: unknown };

type Claim = { claimed: string } | { done: string };

/** SHA-256 (hex) of the route and the body as JSON (the validated body, so its key order is fixed). */
export function requestFingerprint(request: IdempotentRequest): string {
  return createHash('sha256')
    .update(JSON.stringify([request.route, request.body ?? null]))
    .digest('hex');
}

@Injectable()
export class IdempotencyService {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  /**
   * Runs `act` once per (user, key). Without a key, just runs it.
   * @param act does the work; calls `finish` inside its transaction with the id of what it made
   * @param replay answers a repeat from the id the first request made
   */
  async once<T>(
    userId: string,
    key: string | undefined,
    request: IdempotentRequest,
    act: (finish: FinishIdempotent) => Promise<T>,
    replay: (resourceId: string) => Promise<T>,
  ): Promise<T> {
    if (key === undefined) return act(() => Promise.resolve());
    const claim = await this.claim(userId, key, requestFingerprint(request));
    if ('done' in claim) return replay(claim.done);
    try {
      return await act(async (manager, resourceId) => {
        await manager
          .getRepository(IdempotencyKey)
          .update({ id: claim.claimed }, { status: 'done', resourceId, completedAt: new Date() });
      });
    } catch (error) {
      // Only a claim still pending is released: a change that committed keeps its key.
      await this.dataSource
        .getRepository(IdempotencyKey)
        .delete({ id: claim.claimed, status: 'pending' })
        .catch(() => undefined);
      throw error;
    }
  }

  private async claim(userId: string, key: string, fingerprint: string): Promise<Claim> {
    await this.dataSource.query(
      `DELETE FROM idempotency_keys WHERE created_at < now() - make_interval(hours => $1)`,
      [KEEP_HOURS],
    );
    // A few rounds: the row seen as taken may be released (its request failed) before it is read.
    for (let round = 0; round < 3; round++) {
      const inserted = await this.dataSource.query<{ id: string }[]>(
        `INSERT INTO idempotency_keys (user_id, key, fingerprint) VALUES ($1, $2, $3)
         ON CONFLICT ON CONSTRAINT "UQ_idempotency_keys_user_key" DO UPDATE SET created_at = now()
           WHERE idempotency_keys.status = 'pending'
             AND idempotency_keys.fingerprint = EXCLUDED.fingerprint
             AND idempotency_keys.created_at < now() - make_interval(secs => $4)
         RETURNING id`,
        [userId, key, fingerprint, ABANDONED_AFTER_SECONDS],
      );
      if (inserted.length > 0) return { claimed: inserted[0].id };
      const existing = await this.dataSource.getRepository(IdempotencyKey).findOneBy({ userId, key });
      if (!existing) continue;
      if (existing.fingerprint !== fingerprint) throw new UnprocessableEntityException(KEY_REUSED_MESSAGE);
      if (existing.status === 'done' && existing.resourceId) return { done: existing.resourceId };
      throw new ConflictException(KEY_IN_FLIGHT_MESSAGE);
    }
    throw new ConflictException(KEY_IN_FLIGHT_MESSAGE);
  }
}
