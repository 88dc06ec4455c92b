import { ConflictException, Injectable, NotFoundException, type OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { builtInPracticePhrases, type CreatePracticePhraseInput, type PracticePhrase } from '@keyloom/shared';
import type { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { ClientAccessService } from '../clients/client-access.service';
import { clientRowsHook, WithdrawalHooks } from '../consents/withdrawal-hooks';
import { isUniqueViolation } from '../database/database-errors';
import { PracticePhraseRow } from './practice-phrase.entity';
import { toPracticePhraseDto } from './trial.mapper';

/** Most practice phrases of its own a client can have. */
export const MAX_CLIENT_PHRASES = 200;
export const PHRASE_EXISTS_MESSAGE = 'That phrase is already in the list.';
export const TOO_MANY_PHRASES_MESSAGE = `A client can have at most ${MAX_CLIENT_PHRASES} practice phrases of their own. Remove one first.`;
export const BUILT_IN_PHRASE_MESSAGE = 'Keyloom’s own practice phrases cannot be removed.';
export const PHRASE_NOT_FOUND_MESSAGE = 'There is no practice phrase with that id for this client.';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const builtInTexts = new Set(builtInPracticePhrases.map((p) => p.text.toLowerCase()));

@Injectable()
export class PracticePhrasesService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly access: ClientAccessService,
    private readonly audit: AuditService,
    private readonly withdrawalHooks: WithdrawalHooks,
  ) {}

  onModuleInit(): void {
    // The client's own phrases may quote the client: they go with the training consent.
    this.withdrawalHooks.register(
      'practicePhrases',
      clientRowsHook({
        entity: PracticePhraseRow,
        scope: 'training',
        audit: this.audit,
        action: 'practice-phrase.delete',
        idsKey: 'phraseIds',
      }),
    );
  }

  /** Keyloom's phrases, then the client's own, oldest first (owning clinician, assigned carer, supervisor). */
  async list(actor: Actor, clientId: string): Promise<PracticePhrase[]> {
    await this.access.requireReadable(actor, clientId, 'clinical');
    const rows = await this.dataSource.getRepository(PracticePhraseRow).find({
      where: { clientId },
      relations: { addedBy: true },
      order: { createdAt: 'ASC', id: 'ASC' },
    });
    return [...builtInPracticePhrases, ...rows.map(toPracticePhraseDto)];
  }

  /** Adds one of the client's own (owning clinician); 409 for a repeat (ignoring case) or past the limit. */
  async create(actor: Actor, clientId: string, input: CreatePracticePhraseInput): Promise<PracticePhrase> {
    try {
      return await this.dataSource.transaction(async (manager) => {
        await this.access.requireOwned(actor, clientId, manager);
        // One writer per client at a time, so the limit and the repeat check hold under races.
        await manager.query('SELECT 1 FROM clients WHERE id = $1 FOR UPDATE', [clientId]);
        if (builtInTexts.has(input.text.toLowerCase())) throw new ConflictException(PHRASE_EXISTS_MESSAGE);
        const repo = manager.getRepository(PracticePhraseRow);
        const repeat = await repo
          .createQueryBuilder('p')
          .where('p.clientId = :clientId AND lower(p.text) = lower(:text)', { clientId, text: input.text })
          .getExists();
        if (repeat) throw new ConflictException(PHRASE_EXISTS_MESSAGE);
        if ((await repo.countBy({ clientId })) >= MAX_CLIENT_PHRASES) {
          throw new ConflictException(TOO_MANY_PHRASES_MESSAGE);
        }
        const saved = await repo.save(repo.create({ clientId, text: input.text, addedById: actor.id }));
        await this.audit.record(
          actor,
          'practice-phrase.create',
          { type: 'practice-phrase', id: saved.id, clientId },
          { characters: input.text.length },
          manager,
        );
        return toPracticePhraseDto(
          await repo.findOneOrFail({ where: { id: saved.id }, relations: { addedBy: true } }),
        );
      });
    } catch (error) {
      if (isUniqueViolation(error)) throw new ConflictException(PHRASE_EXISTS_MESSAGE);
      throw error;
    }
  }

  /** Removes one of the client's own phrases (owning clinician); Keyloom's own: 409. */
  async remove(actor: Actor, clientId: string, phraseId: string): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      await this.access.requireOwned(actor, clientId, manager);
      if (builtInPracticePhrases.some((p) => p.id === phraseId)) {
        throw new ConflictException(BUILT_IN_PHRASE_MESSAGE);
      }
      if (!UUID.test(phraseId)) throw new NotFoundException(PHRASE_NOT_FOUND_MESSAGE);
      const repo = manager.getRepository(PracticePhraseRow);
      const row = await repo.findOneBy({ id: phraseId, clientId });
      if (!row) throw new NotFoundException(PHRASE_NOT_FOUND_MESSAGE);
      await repo.delete({ id: phraseId });
      await this.audit.record(
        actor,
        'practice-phrase.delete',
        { type: 'practice-phrase', id: phraseId, clientId },
        { characters: row.text.length },
        manager,
      );
    });
  }
}
