import { afterEach, describe, expect, it, vi } from 'vitest';
import { profileVersion, VERSION_1_ID } from '../testing/profile-data';
import { mockFetch } from '@/testing/mock-fetch';
import { getProfileVersion } from './get-profile-version';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('getProfileVersion', () => {
  it('keeps every field the API sends: sign-off, approval, send-back, the base weight and its model hash', async () => {
    const sent = profileVersion({
      status: 'active',
      baseWeight: 0.27,
      baseModelSha256: 'c'.repeat(64),
      signedOffBy: 'Hannah Ashby',
      signedOffAt: '2026-09-22T10:00:00.000Z',
      signOffComment: 'He typed his club message without help.',
      approvedBy: 'Dr. Mira Okafor',
      approvedAt: '2026-09-23T10:00:00.000Z',
      approvalComment: 'Approved after the second trial.',
      sentBackReason: null,
    });
    mockFetch({ [`GET /api/profile-versions/${VERSION_1_ID}`]: { body: sent } });
    const version = await getProfileVersion(VERSION_1_ID);
    expect(version.approvalComment).toBe('Approved after the second trial.');
    expect(version).toEqual(sent);
  });
});
