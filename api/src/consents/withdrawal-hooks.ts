import { Injectable } from '@nestjs/common';
import type { ConsentScope } from '@keyloom/shared';
import type { EntityManager, EntityTarget, FindOptionsWhere } from 'typeorm';
import type { AuditAction, AuditService } from '../audit/audit.service';

/**
 * What one module keeps that a consent scope allows, and how to remove it. Both functions run inside
 * the withdrawal's (or the preview's) transaction: use `manager`, never a separate connection.
 */
export type WithdrawalHook = {
  /** The consent scope the data depends on: it is removed only when no consent in force covers it. */
  scope: ConsentScope;
  /** 'delete' (the default): rows are deleted; 'cancel': pending work is stopped, nothing deleted. */
  effect?: 'delete' | 'cancel';
  /** How many rows `remove` would affect now, including rows that go by a foreign-key cascade. */
  count: (clientId: string, manager: EntityManager) => Promise<number>;
  /** Deletes (or cancels) the client's rows. Rows of another hook may go with them by cascade. */
  remove: (clientId: string, manager: EntityManager) => Promise<void>;
};

/** Counts per hook name, split by effect; a hook whose scope stays covered counts 0 (not asked). */
export type WithdrawalCounts = { deleted: Record<string, number>; cancelled: Record<string, number> };

/**
 * The registry of everything a consent withdrawal may remove. Modules register in onModuleInit
 * (samples, sampleFlags, profileVersions, trials, practicePhrases, summaryEmails); ConsentsService
 * decides which scopes no consent in force covers any more and runs the hooks of those scopes.
 */
@Injectable()
export class WithdrawalHooks {
  private readonly hooks = new Map<string, WithdrawalHook>();

  /** Adds a hook under a unique name (the key of its count in the withdrawal report). */
  register(name: string, hook: WithdrawalHook): void {
    if (this.hooks.has(name)) throw new Error(`A withdrawal hook named "${name}" is already registered.`);
    this.hooks.set(name, hook);
  }

  /** The registered names, in registration order. */
  names(): string[] {
    return [...this.hooks.keys()];
  }

  /**
   * Counts what the hooks of the `released` scopes would affect. Every count is taken before anything
   * is removed, so rows that a cascade takes with another hook's rows (trials with their profile
   * version, flags with their sample) are still counted under their own name.
   */
  async countAll(
    clientId: string,
    released: readonly ConsentScope[],
    manager: EntityManager,
  ): Promise<WithdrawalCounts> {
    const counts: WithdrawalCounts = { deleted: {}, cancelled: {} };
    for (const [name, hook] of this.hooks) {
      const isReleased = released.includes(hook.scope);
      counts[hook.effect === 'cancel' ? 'cancelled' : 'deleted'][name] = isReleased
        ? await hook.count(clientId, manager)
        : 0;
    }
    return counts;
  }

  /**
   * Counts, then removes, in registration order, for the `released` scopes only. A failing hook
   * fails (and so rolls back) the withdrawal.
   */
  async runAll(
    clientId: string,
    released: readonly ConsentScope[],
    manager: EntityManager,
  ): Promise<WithdrawalCounts> {
    const counts = await this.countAll(clientId, released, manager);
    for (const hook of this.hooks.values()) {
      if (released.includes(hook.scope)) await hook.remove(clientId, manager);
    }
    return counts;
  }
}

/**
 * The usual hook: every row of `entity` whose clientId is the client's, deleted and audited as one
 * event (no actor: the consent.withdraw event beside it names who withdrew) with the rows' ids.
 */
export function clientRowsHook<T extends { id: string; clientId: string }>(options: {
  entity: EntityTarget<T>;
  scope: ConsentScope;
  audit: AuditService;
  action: AuditAction;
  idsKey: string;
}): WithdrawalHook {
  const where = (clientId: string) => ({ clientId }) as FindOptionsWhere<T>;
  return {
    scope: options.scope,
    count: (clientId, manager) => manager.getRepository(options.entity).countBy(where(clientId)),
    remove: async (clientId, manager) => {
      const repo = manager.getRepository(options.entity);
      const rows = await repo.find({ where: where(clientId), select: { id: true } as never });
      if (rows.length === 0) return;
      await repo.delete(where(clientId));
      await options.audit.record(
        null,
        options.action,
        { type: 'client', id: clientId, clientId },
        { cause: 'consent-withdrawn', count: rows.length, [options.idsKey]: rows.map((r) => r.id) },
        manager,
      );
    },
  };
}
