import type { EntityManager } from 'typeorm';
import { WithdrawalHooks } from './withdrawal-hooks';

const CLIENT_ID = '33333333-3333-4333-8333-333333333333';
const manager = {} as EntityManager;

describe(WithdrawalHooks.name, () => {
  it('runs every hook with the client and the transaction’s manager, and reports each count by name', async () => {
    const sut = new WithdrawalHooks();
    const calls: string[] = [];
    sut.register('samples', (clientId, m) => {
      calls.push(`samples:${clientId}:${m === manager}`);
      return Promise.resolve(4);
    });
    sut.register('profileVersions', () => {
      calls.push('profileVersions');
      return Promise.resolve(0);
    });
    await expect(sut.runAll(CLIENT_ID, manager)).resolves.toEqual({ samples: 4, profileVersions: 0 });
    expect(calls).toEqual([`samples:${CLIENT_ID}:true`, 'profileVersions']);
    expect(sut.names()).toEqual(['samples', 'profileVersions']);
  });

  it('refuses a second hook under the same name (its count would be lost)', () => {
    const sut = new WithdrawalHooks();
    sut.register('samples', () => Promise.resolve(0));
    expect(() => sut.register('samples', () => Promise.resolve(0))).toThrow(/already registered/);
  });

  it('lets a failing hook fail the whole run, so the withdrawal transaction rolls back', async () => {
    const sut = new WithdrawalHooks();
    const after = jest.fn(() => Promise.resolve(1));
    sut.register('broken', () => Promise.reject(new Error('disk on fire')));
    sut.register('after', after);
    await expect(sut.runAll(CLIENT_ID, manager)).rejects.toThrow('disk on fire');
    expect(after).not.toHaveBeenCalled();
  });

  it('answers an empty report when nothing is registered', async () => {
    await expect(new WithdrawalHooks().runAll(CLIENT_ID, manager)).resolves.toEqual({});
  });
});
