import { ConflictException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { ClientVocabulary, ClientVocabularyState, updateClientVocabularySchema } from '@keyloom/shared';
import { DataSource, type EntityManager } from 'typeorm';
import type { z } from 'zod';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { ClientAccessService } from '../clients/client-access.service';
import { ClientVocabularyRow } from './client-vocabulary.entity';

export const EMPTY_CLIENT_VOCABULARY: ClientVocabulary = { additions: [], blocks: [] };

/** 409: the PUT named a revision that is no longer the current one. */
export function staleRevisionMessage(current: number): string {
  return (
    `This vocabulary list was changed since you opened it (it is now at revision ${current}). ` +
    'Reload it and make your change again.'
  );
}

/** The client's current list, or the empty list at revision 0 (nothing saved yet). */
export async function currentClientVocabulary(
  manager: EntityManager,
  clientId: string,
): Promise<{ revision: number; vocabulary: ClientVocabulary; keptSpellings: string[] }> {
  const row = await manager.getRepository(ClientVocabularyRow).findOneBy({ clientId });
  return row
    ? { revision: row.revision, vocabulary: row.vocabulary, keptSpellings: row.keptSpellings }
    : { revision: 0, vocabulary: EMPTY_CLIENT_VOCABULARY, keptSpellings: [] };
}

/** Counts for the audit log (never the words: the log holds no client text). */
function counts(v: { vocabulary: ClientVocabulary; keptSpellings: string[] }) {
  return {
    additions: v.vocabulary.additions.length,
    blocks: v.vocabulary.blocks.length,
    kept: v.keptSpellings.length,
  };
}

/** GET/PUT /api/clients/:id/vocabulary: the client's current list (what the next version freezes). */
@Injectable()
export class VocabularyService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly access: ClientAccessService,
    private readonly audit: AuditService,
  ) {}

  /** Owning clinician and supervisor (as the samples it is made from); carers and admins 403. */
  async get(actor: Actor, clientId: string): Promise<ClientVocabularyState> {
    await this.access.requireReadable(actor, clientId, 'samples');
    return this.state(this.dataSource.manager, clientId);
  }

  /**
   * Saves the list when `input.revision` is the current one (owning clinician); else 409 and
   * nothing changes. The row is locked (or inserted once), so of two saves of one revision
   * exactly one wins.
   */
  async update(
    actor: Actor,
    clientId: string,
    input: z.output<typeof updateClientVocabularySchema>,
  ): Promise<ClientVocabularyState> {
    return this.dataSource.transaction(async (manager) => {
      await this.access.requireOwned(actor, clientId, manager);
      const repo = manager.getRepository(ClientVocabularyRow);
      const row = await repo.findOne({ where: { clientId }, lock: { mode: 'pessimistic_write' } });
      const before = row
        ? { revision: row.revision, vocabulary: row.vocabulary, keptSpellings: row.keptSpellings }
        : { revision: 0, vocabulary: EMPTY_CLIENT_VOCABULARY, keptSpellings: [] };
      if (input.revision !== before.revision)
        throw new ConflictException(staleRevisionMessage(before.revision));
      const keptSpellings = [...new Set(input.keptSpellings)];
      const values = {
        revision: before.revision + 1,
        vocabulary: input.vocabulary,
        keptSpellings,
        updatedAt: new Date(),
        updatedById: actor.id,
      };
      if (row) {
        await repo.update({ clientId, revision: before.revision }, values);
      } else {
        // Two first saves at once: the second insert finds the row and is stale.
        const inserted: unknown[] = await manager.query(
          `INSERT INTO client_vocabularies (client_id, revision, vocabulary, kept_spellings, updated_at, updated_by_id)
           VALUES ($1, $2, $3::jsonb, $4::jsonb, $5, $6) ON CONFLICT (client_id) DO NOTHING RETURNING client_id`,
          [
            clientId,
            values.revision,
            JSON.stringify(values.vocabulary),
            JSON.stringify(keptSpellings),
            values.updatedAt,
            actor.id,
          ],
        );
        if (inserted.length === 0) {
          const now = await currentClientVocabulary(manager, clientId);
          throw new ConflictException(staleRevisionMessage(now.revision));
        }
      }
      await this.audit.record(
        actor,
        'vocabulary.update',
        { type: 'client-vocabulary', id: clientId, clientId },
        {
          revision: values.revision,
          before: counts(before),
          after: counts({ vocabulary: input.vocabulary, keptSpellings }),
        },
        manager,
      );
      return this.state(manager, clientId);
    });
  }

  private async state(manager: EntityManager, clientId: string): Promise<ClientVocabularyState> {
    const row = await manager
      .getRepository(ClientVocabularyRow)
      .findOne({ where: { clientId }, relations: { updatedBy: true } });
    if (!row) {
      return {
        clientId,
        revision: 0,
        vocabulary: EMPTY_CLIENT_VOCABULARY,
        keptSpellings: [],
        updatedAt: null,
        updatedBy: null,
      };
    }
    return {
      clientId,
      revision: row.revision,
      vocabulary: row.vocabulary,
      keptSpellings: row.keptSpellings,
      updatedAt: row.updatedAt.toISOString(),
      updatedBy: row.updatedById ? (row.updatedBy?.name ?? '(removed account)') : null,
    };
  }
}
