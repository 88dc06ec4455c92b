import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';

/**
 * Deletes what one module derived from a client's writing and answers how many rows it removed.
 * Runs inside the withdrawal's transaction: use `manager`, never a separate connection.
 */
export type WithdrawalHook = (clientId: string, manager: EntityManager) => Promise<number>;

/**
 * The registry of everything a consent withdrawal must delete. Modules register in onModuleInit
 * (samples: 'samples'; later issues: 'profileVersions', …); ConsentsService runs them all in one
 * transaction with marking the consent withdrawn and the audit event.
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

  /** Runs every hook in registration order; a failing hook fails (and so rolls back) the withdrawal. */
  async runAll(clientId: string, manager: EntityManager): Promise<Record<string, number>> {
    const counts: Record<string, number> = {};
    for (const [name, hook] of this.hooks) counts[name] = await hook(clientId, manager);
    return counts;
  }
}
