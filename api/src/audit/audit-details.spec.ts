import { CLIENT_TEXT_KEYS, withoutClientText } from './audit-details';

describe('withoutClientText', () => {
  it('drops free-text keys at any depth and keeps ids, counts, sizes and field names', () => {
    const result = withoutClientText({
      text: 'I want the blue cup please',
      count: 2,
      phraseIds: ['a', 'b'],
      fields: ['note', 'relationship'],
      nested: {
        comment: 'Tried at lunch with Ada',
        byteSize: 120,
        list: [{ fileName: 'Ada diary.txt', sha256: 'ff' }],
      },
    });
    expect(result.details).toEqual({
      count: 2,
      phraseIds: ['a', 'b'],
      fields: ['note', 'relationship'],
      nested: { byteSize: 120, list: [{ sha256: 'ff' }] },
    });
    expect(result.removed).toEqual(['text', 'nested.comment', 'nested.list[0].fileName']);
  });

  it('leaves details without free text as they are', () => {
    const details = { samplesDeleted: 0, derived: { trials: 0 }, at: null };
    expect(withoutClientText(details)).toEqual({ details, removed: [] });
  });

  it('covers the kinds of text a client record holds', () => {
    for (const key of ['text', 'note', 'comment', 'reason', 'fileName', 'relationship']) {
      expect(CLIENT_TEXT_KEYS.has(key)).toBe(true);
    }
  });
});
