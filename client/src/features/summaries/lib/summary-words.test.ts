import { describe, expect, it } from 'vitest';
import { contactBlockedReason, failureWords, recipientState } from './summary-words';

describe('recipientState', () => {
  it('puts a used stop link first, then the delivery status, and tells a retry from a first wait', () => {
    expect(recipientState({ status: 'sent', attempts: 1, stopped: true })).toBe('stopped');
    expect(recipientState({ status: 'queued', attempts: 0, stopped: false })).toBe('queued');
    expect(recipientState({ status: 'queued', attempts: 2, stopped: false })).toBe('retrying');
    expect(recipientState({ status: 'sent', attempts: 1, stopped: false })).toBe('sent');
    expect(recipientState({ status: 'failed', attempts: 12, stopped: false })).toBe('failed');
  });
});

describe('failureWords', () => {
  // Reply classes from RFC 5321 §4.2.1: 5yz permanent negative, 4yz transient negative.
  it.each([
    [null, null],
    ['', null],
    [
      '550 mailbox unavailable',
      'The receiving mail server refused this e-mail for good (550 mailbox unavailable).',
    ],
    [
      "Can't send mail - all recipients were rejected: 553 5.1.3 bad address",
      "The receiving mail server refused this e-mail for good (Can't send mail - all recipients were rejected: 553 5.1.3 bad address).",
    ],
    ['421 try later', 'The receiving mail server asked to try later (421 try later).'],
    [
      'connect ECONNREFUSED 127.0.0.1:2525',
      'The mail server could not be reached (connect ECONNREFUSED 127.0.0.1:2525).',
    ],
    [
      'Not sent: the contact stopped summaries or no longer consents.',
      'Not sent: the contact stopped summaries or no longer consents.',
    ],
    ['Something odd', 'The mail server answered: Something odd'],
  ])('%p → %p', (error, words) => {
    expect(failureWords(error)).toBe(words);
  });
});

describe('contactBlockedReason', () => {
  it('names the stop link before the missing consent, and nothing for a consenting contact', () => {
    expect(contactBlockedReason({ consentToSummaries: true, unsubscribedAt: null })).toBeNull();
    expect(contactBlockedReason({ consentToSummaries: false, unsubscribedAt: null })).toBe(
      'Has not agreed to receive summaries.',
    );
    expect(
      contactBlockedReason({ consentToSummaries: true, unsubscribedAt: '2026-11-20T08:00:00.000Z' }),
    ).toMatch(/^Stopped summaries/);
  });
});
