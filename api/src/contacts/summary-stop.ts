import type { EntityManager } from 'typeorm';

/**
 * Records that `email` asked for no more summaries about the client (the stop link), and marks every
 * contact of the client carrying that address (any case) as stopped. Idempotent.
 */
export async function stopAddress(manager: EntityManager, clientId: string, email: string): Promise<void> {
  await manager.query(
    `INSERT INTO summary_stops (client_id, email_key) VALUES ($1, lower($2)) ON CONFLICT DO NOTHING`,
    [clientId, email],
  );
  await manager.query(
    `UPDATE family_contacts SET unsubscribed_at = s.stopped_at
       FROM summary_stops s
      WHERE family_contacts.client_id = $1 AND s.client_id = $1 AND s.email_key = lower($2)
        AND lower(family_contacts.email) = s.email_key AND family_contacts.unsubscribed_at IS NULL`,
    [clientId, email],
  );
}
