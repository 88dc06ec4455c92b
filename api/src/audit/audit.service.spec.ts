import type { Repository } from 'typeorm';
import type { AuditEvent } from './audit-event.entity';
import { AuditService } from './audit.service';

/** A repository that keeps what save() was given. */
function fakeEvents() {
  const saved: Partial<AuditEvent>[] = [];
  const repo = {
    create: (row: Partial<AuditEvent>) => row,
    save: (row: Partial<AuditEvent>) => {
      saved.push(row);
      return Promise.resolve(row);
    },
  } as unknown as Repository<AuditEvent>;
  return { repo, saved };
}

describe(AuditService.name, () => {
  const actor = { id: '11111111-1111-4111-8111-111111111111', email: 'clinician@willowmere.example' };
  const clientId = '22222222-2222-4222-8222-222222222222';

  it('never stores free text in an event about a client, whatever the caller passes', async () => {
    const { repo, saved } = fakeEvents();
    const sut = new AuditService(repo);
    await sut.record(
      actor,
      'practice-phrase.create',
      { type: 'practice-phrase', id: 'p1', clientId },
      { text: 'my sister Ada is in hospital', characters: 28 },
    );
    expect(saved).toHaveLength(1);
    expect(saved[0].details).toEqual({ characters: 28 });
    expect(JSON.stringify(saved[0])).not.toContain('hospital');
  });

  it('keeps the details of events that are not about a client (a sign-in refusal keeps its reason)', async () => {
    const { repo, saved } = fakeEvents();
    const sut = new AuditService(repo);
    await sut.record({ id: null, email: 'x@y.example' }, 'auth.sign-in-failed', null, {
      reason: 'wrong-password',
    });
    expect(saved[0].details).toEqual({ reason: 'wrong-password' });
  });
});
