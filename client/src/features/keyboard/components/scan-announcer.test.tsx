import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { keyRows } from '../logic/layouts';
import { ScanAnnouncer } from './scan-announcer';

const props = {
  state: { level: 'items', row: 1, item: 0, idlePasses: 0 } as const,
  words: [],
  keyRows: keyRows('typewriter'),
  config: { pattern: 'auto-row-column', suggestionsAt: 'first' } as const,
};

describe('ScanAnnouncer', () => {
  it('a polite, visually hidden live region says the highlight only when the setting is on', () => {
    const { rerender } = render(<ScanAnnouncer enabled={false} {...props} />);
    const region = screen.getByRole('status');
    expect(region).toHaveAttribute('aria-live', 'polite');
    expect(region).toHaveClass('sr-only');
    expect(region).toHaveTextContent(/^$/);
    rerender(<ScanAnnouncer enabled {...props} />);
    expect(region).toHaveTextContent('Key: q');
  });
});
