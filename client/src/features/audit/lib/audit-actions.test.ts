import { describe, expect, it } from 'vitest';
import { summariseDetails } from './audit-actions';

describe('summariseDetails', () => {
  // trial.create events written before the rename keep their keys (the audit log is append-only).
  it('shows a trial event under the old detail keys and under the new ones alike', () => {
    const id = '0f8e2c1a-6b4d-4e3f-9a21-7c5d3b1e0a99';
    expect(summariseDetails({ clientTrialId: id, method: 'scanning', keystrokes: 12 })).toBe(
      'clientTrialId: 0f8e2c1a-6b4…; method: scanning; keystrokes: 12',
    );
    expect(summariseDetails({ localTrialId: id, selectionMode: 'dwell', keystrokes: 9 })).toBe(
      'localTrialId: 0f8e2c1a-6b4…; selectionMode: dwell; keystrokes: 9',
    );
  });
});
