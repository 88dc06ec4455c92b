import { describe, expect, it } from 'vitest';
import { keyRows } from './layouts';
import { describeScanHighlight } from './scan-announcement';
import type { ScanConfig } from './scanner';

const rows = keyRows('typewriter');
const words = ['tea', 'time'];
const rowColumn: ScanConfig = { pattern: 'auto-row-column', suggestionsAt: 'first' };
const groups: ScanConfig = { pattern: 'auto-group-row-key', suggestionsAt: 'first' };
const say = (state: Parameters<typeof describeScanHighlight>[0], config = rowColumn) =>
  describeScanHighlight(state, words, rows, config);

describe('describeScanHighlight', () => {
  it('says the suggestion row, a key row with its first keys, a key and a word', () => {
    expect(say({ level: 'rows', row: 0, item: 0, idlePasses: 0 })).toBe('Suggestions');
    // Typewriter row 2 (a s d f g h j k l): its first five keys, then "…".
    expect(say({ level: 'rows', row: 2, item: 0, idlePasses: 0 })).toBe('Row 2: a s d f g …');
    expect(say({ level: 'items', row: 1, item: 2, idlePasses: 0 })).toBe('Key: e');
    expect(say({ level: 'items', row: 0, item: 1, idlePasses: 0 })).toBe('Suggestion: time');
  });

  it('says nothing when nothing is highlighted', () => {
    expect(say(null)).toBe('');
    expect(say({ level: 'rows', row: 1, item: 0, idlePasses: 0, waiting: true })).toBe('');
  });

  it('group–row–key groups say their rows', () => {
    // Suggestions first, then the key rows in groups of 3 + 2 (five key rows).
    expect(rows).toHaveLength(5);
    expect(say({ level: 'groups', row: 0, item: 0, idlePasses: 0, group: 0 }, groups)).toBe('Suggestions');
    expect(say({ level: 'groups', row: 1, item: 0, idlePasses: 0, group: 1 }, groups)).toBe(
      'Group: rows 1 to 3',
    );
    expect(say({ level: 'groups', row: 4, item: 0, idlePasses: 0, group: 2 }, groups)).toBe(
      'Group: rows 4 to 5',
    );
  });
});
