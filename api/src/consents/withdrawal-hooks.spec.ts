import type { EntityManager } from 'typeorm';
import { type WithdrawalHook, WithdrawalHooks } from './withdrawal-hooks';

const CLIENT_ID = '33333333-3333-4333-8333-333333333333';
const manager = {} as EntityManager;

/** A hook over an in-memory table of `rows` rows; `log` records the calls in order. */
const tableHook = (
  log: string[],
  name: string,
  rows: { n: number },
  extra: Partial<WithdrawalHook> = {},
): WithdrawalHook => ({
  scope: 'training',
  count: (clientId, m) => {
    log.push(`count ${name}:${clientId === CLIENT_ID}:${m === manager}`);
    return Promise.resolve(rows.n);
  },
  remove: () => {
    log.push(`remove ${name}`);
    rows.n = 0;
    return Promise.resolve();
  },
  ...extra,
});

describe(WithdrawalHooks.name, () => {
  it('counts every hook of a released scope before removing any, so cascaded rows are still counted', async () => {
    const sut = new WithdrawalHooks();
    const log: string[] = [];
    const versions = { n: 3 };
    const trials = { n: 7 };
    // Removing the versions takes the trials with them (a cascade), before the trials hook runs.
    sut.register('profileVersions', {
      ...tableHook(log, 'profileVersions', versions),
      remove: () => {
        log.push('remove profileVersions');
        versions.n = 0;
        trials.n = 0;
        return Promise.resolve();
      },
    });
    sut.register('trials', tableHook(log, 'trials', trials));
    await expect(sut.runAll(CLIENT_ID, ['training'], manager)).resolves.toEqual({
      deleted: { profileVersions: 3, trials: 7 },
      cancelled: {},
    });
    expect(log).toEqual([
      'count profileVersions:true:true',
      'count trials:true:true',
      'remove profileVersions',
      'remove trials',
    ]);
    expect(sut.names()).toEqual(['profileVersions', 'trials']);
  });

  it('runs only the hooks of the released scopes; a cancelling hook is reported apart', async () => {
    const sut = new WithdrawalHooks();
    const log: string[] = [];
    sut.register('samples', tableHook(log, 'samples', { n: 2 }));
    sut.register(
      'summaryEmails',
      tableHook(log, 'summaryEmails', { n: 4 }, { scope: 'summaries', effect: 'cancel' }),
    );
    // The samples stay (training is still covered): reported as 0, never asked or removed.
    await expect(sut.runAll(CLIENT_ID, ['summaries'], manager)).resolves.toEqual({
      deleted: { samples: 0 },
      cancelled: { summaryEmails: 4 },
    });
    expect(log).toEqual(['count summaryEmails:true:true', 'remove summaryEmails']);
    await expect(sut.runAll(CLIENT_ID, [], manager)).resolves.toEqual({
      deleted: { samples: 0 },
      cancelled: { summaryEmails: 0 },
    });
    expect(log).toHaveLength(2);
  });

  it('counts without removing for a preview', async () => {
    const sut = new WithdrawalHooks();
    const log: string[] = [];
    const rows = { n: 5 };
    sut.register('samples', tableHook(log, 'samples', rows));
    await expect(sut.countAll(CLIENT_ID, ['training'], manager)).resolves.toEqual({
      deleted: { samples: 5 },
      cancelled: {},
    });
    expect(rows.n).toBe(5);
    expect(log).toEqual(['count samples:true:true']);
  });

  it('refuses a second hook under the same name (its count would be lost)', () => {
    const sut = new WithdrawalHooks();
    sut.register('samples', tableHook([], 'samples', { n: 0 }));
    expect(() => sut.register('samples', tableHook([], 'samples', { n: 0 }))).toThrow(/already registered/);
  });

  it('lets a failing hook fail the whole run, so the withdrawal transaction rolls back', async () => {
    const sut = new WithdrawalHooks();
    const log: string[] = [];
    sut.register('broken', {
      ...tableHook(log, 'broken', { n: 1 }),
      remove: () => Promise.reject(new Error('disk on fire')),
    });
    sut.register('after', tableHook(log, 'after', { n: 1 }));
    await expect(sut.runAll(CLIENT_ID, ['training'], manager)).rejects.toThrow('disk on fire');
    expect(log).not.toContain('remove after');
  });
});
