import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { keyRows } from '../logic/layouts';
import { LARGE_TARGET_PX } from '../logic/keyboard-styles';
import { type DwellView, KeyGrid } from './key-grid';
import { SuggestionRow } from './suggestion-row';

const rows = keyRows('typewriter');

const dwellOn = (activeId: string | null, progress: number, chosenId: string | null = null): DwellView => ({
  activeId,
  progress,
  chosenId,
  targetProps: () => ({ onPointerEnter: () => undefined, onPointerLeave: () => undefined }),
});

/** The grid with today's defaults and `props` on top. */
const gridOf = (props: Partial<Parameters<typeof KeyGrid>[0]> = {}) => (
  <KeyGrid
    rows={rows}
    onSelect={() => undefined}
    highContrast={false}
    largeTargets={false}
    reduceMotion={false}
    textScale={1}
    letterProbabilities={null}
    scan={null}
    dwell={null}
    {...props}
  />
);
const grid = (props: Partial<Parameters<typeof KeyGrid>[0]> = {}) => render(gridOf(props));

const keyRowsOf = () => [...screen.getByRole('group', { name: 'Keys' }).children] as HTMLElement[];
const px = (value: string) => Number(value.replace('px', ''));

describe('KeyGrid targets, spacing and dwell', () => {
  it('large targets give every key a 64 × 64 px least size and rows that wrap instead of shrinking', () => {
    const { rerender } = grid();
    const key = screen.getByRole('button', { name: 'e' });
    expect(key.style.minWidth).toBe('');
    expect(keyRowsOf()[0]!.style.gridTemplateColumns).toBe('repeat(10, minmax(0, 1fr))');
    rerender(gridOf({ largeTargets: true }));
    for (const button of screen.getAllByRole('button')) {
      expect(px(button.style.minWidth)).toBeGreaterThanOrEqual(LARGE_TARGET_PX);
      expect(px(button.style.minHeight)).toBeGreaterThanOrEqual(64);
    }
    // At most ten columns, none narrower than 64 px: a narrow grid gets fewer columns per line.
    expect(keyRowsOf()[0]!.style.gridTemplateColumns).toContain('auto-fill');
    expect(keyRowsOf()[0]!.style.gridTemplateColumns).toContain('max(64px');
  });

  it('the spacing setting changes the gap between keys and between rows', () => {
    const { rerender } = grid();
    const outer = screen.getByRole('group', { name: 'Keys' });
    expect(outer.style.gap).toBe('8px');
    expect(keyRowsOf()[0]!.style.gap).toBe('8px');
    for (const [spacing, gap] of [
      ['medium', '16px'],
      ['large', '24px'],
    ] as const) {
      rerender(gridOf({ keySpacing: spacing }));
      expect(outer.style.gap).toBe(gap);
      expect(keyRowsOf().every((row) => row.style.gap === gap)).toBe(true);
    }
  });

  it('the dwell fill covers the whole key, rising from the bottom as the dwell runs', () => {
    const { rerender } = grid({ dwell: dwellOn('letter-e', 0.4) });
    const key = screen.getByRole('button', { name: 'e' });
    const fill = key.querySelector<HTMLElement>('[data-dwell-fill]')!;
    expect(fill.className).toContain('inset-x-0');
    expect(fill.className).toContain('bottom-0');
    expect(fill.style.height).toBe('40%');
    expect(fill.style.width).toBe('');
    rerender(gridOf({ highContrast: true, reduceMotion: true, dwell: dwellOn('letter-e', 0.6) }));
    // Reduced motion: quarter steps.
    expect(key.querySelector<HTMLElement>('[data-dwell-fill]')!.style.height).toBe('50%');
    expect(screen.getByRole('button', { name: 'r' }).querySelector('[data-dwell-fill]')).toBeNull();
  });

  it('the chosen key flashes: an outline and a dark background', () => {
    grid({ dwell: dwellOn(null, 0, 'letter-t') });
    const chosen = screen.getByRole('button', { name: 't' });
    expect(chosen).toHaveAttribute('data-chosen', 'on');
    expect(chosen.className).toContain('outline-6');
    expect(chosen.style.backgroundColor).toBe('rgb(29, 43, 79)');
    const other = screen.getByRole('button', { name: 'y' });
    expect(other).not.toHaveAttribute('data-chosen');
    expect(other.style.backgroundColor).toBe('rgb(255, 255, 255)');
  });

  it('arrow keys still move between the keys of a row with large targets', async () => {
    const onSelect = vi.fn();
    grid({ largeTargets: true, onSelect });
    const first = within(keyRowsOf()[0]!).getAllByRole('button')[0]!;
    first.focus();
    await userEvent.keyboard('{ArrowRight}{ArrowDown}{Enter}');
    expect(onSelect).toHaveBeenCalledWith(rows[1]![1]);
  });
});

describe('SuggestionRow targets, spacing and dwell', () => {
  const row = (props: Partial<Parameters<typeof SuggestionRow>[0]> = {}) =>
    render(
      <SuggestionRow
        slots={4}
        words={['tea', 'time', 'the']}
        seq={null}
        onPick={() => undefined}
        highContrast={false}
        largeTargets={false}
        reduceMotion={false}
        textScale={1}
        scan={null}
        dwell={null}
        {...props}
      />,
    );

  it('large targets, spacing, the fill and the chosen flash on the slots', () => {
    row({ largeTargets: true, keySpacing: 'large', dwell: dwellOn('suggestion-1', 0.75, 'suggestion-0') });
    const group = screen.getByRole('group', { name: 'Suggestions' });
    expect(group.style.gap).toBe('24px');
    expect(group.style.gridTemplateColumns).toContain('max(64px');
    for (const slot of within(group).getAllByRole('button')) {
      expect(px(slot.style.minWidth)).toBeGreaterThanOrEqual(64);
      expect(px(slot.style.minHeight)).toBeGreaterThanOrEqual(64);
    }
    const time = screen.getByRole('button', { name: 'time (suggestion 2)' });
    expect(time.querySelector<HTMLElement>('[data-dwell-fill]')!.style.height).toBe('75%');
    expect(screen.getByRole('button', { name: 'tea (suggestion 1)' })).toHaveAttribute('data-chosen', 'on');
  });

  it('keeps the old gap and columns without the new settings', () => {
    row();
    const group = screen.getByRole('group', { name: 'Suggestions' });
    expect(group.style.gap).toBe('8px');
    expect(group.style.gridTemplateColumns).toBe('repeat(4, minmax(0, 1fr))');
  });
});

/** The elements scrollIntoView was called on while `run` ran (jsdom has no scrolling of its own). */
const scrollsDuring = (run: () => void): Element[] => {
  const scrolled: Element[] = [];
  const original = Element.prototype.scrollIntoView;
  Element.prototype.scrollIntoView = function (this: Element) {
    scrolled.push(this);
  };
  try {
    run();
  } finally {
    Element.prototype.scrollIntoView = original;
  }
  return scrolled;
};

describe('KeyGrid keeps the scan highlight in sight', () => {
  it('scrolls the scanned row, then the scanned key, into view (a wrapped grid may scroll)', () => {
    let rerender: (ui: ReturnType<typeof gridOf>) => void = () => undefined;
    const onRow = scrollsDuring(() => {
      rerender = grid({ scan: { level: 'rows', row: 2, item: 0 } }).rerender;
    });
    expect(onRow.at(-1)).toBe(keyRowsOf()[2]);
    const onKey = scrollsDuring(() => rerender(gridOf({ scan: { level: 'items', row: 2, item: 3 } })));
    expect(onKey.at(-1)).toBe(keyRowsOf()[2]!.children[3]);
    expect((onKey.at(-1) as HTMLElement).dataset.key).toBe(rows[2]![3]!.id);
  });

  it('brings a highlighted group into sight: its last row, then its first', () => {
    const scrolled = scrollsDuring(() => grid({ scanGroup: '4 5' }));
    expect(scrolled).toEqual([keyRowsOf()[4], keyRowsOf()[3]]);
  });
});
