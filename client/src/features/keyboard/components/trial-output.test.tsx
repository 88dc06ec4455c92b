import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { TrialOutput } from './trial-output';

const props = {
  target: 'can you open the window',
  textScale: 1.5,
  highContrast: false,
  onClear: () => undefined,
  clearDisabled: false,
};

describe('TrialOutput', () => {
  afterEach(() => {
    vi.unstubAllGlobals();
  });

  it('speaks the text typed so far with the browser’s speech synthesis, only when asked', async () => {
    const speak = vi.fn();
    const cancel = vi.fn();
    vi.stubGlobal('speechSynthesis', { speak, cancel });
    vi.stubGlobal(
      'SpeechSynthesisUtterance',
      class {
        constructor(readonly text: string) {}
      },
    );
    render(<TrialOutput {...props} text="can you open" />);
    expect(screen.getByRole('textbox', { name: 'Text typed so far' })).toHaveTextContent('can you open');
    expect(screen.getByText('can you open the window')).toBeInTheDocument();
    expect(speak).not.toHaveBeenCalled();
    await userEvent.click(screen.getByRole('button', { name: 'Speak' }));
    expect(cancel).toHaveBeenCalledTimes(1);
    expect(speak).toHaveBeenCalledTimes(1);
    expect((speak.mock.calls[0]?.[0] as { text: string }).text).toBe('can you open');
  });

  it('says why Speak is unavailable in a browser without speech synthesis', () => {
    vi.stubGlobal('SpeechSynthesisUtterance', undefined);
    render(<TrialOutput {...props} text="hello" />);
    const button = screen.getByRole('button', { name: 'Speak' });
    expect(button).toBeDisabled();
    expect(button).toHaveAccessibleDescription('This browser cannot speak text aloud.');
  });

  it('offers nothing to speak or clear before anything is typed', () => {
    vi.stubGlobal('speechSynthesis', { speak: vi.fn(), cancel: vi.fn() });
    vi.stubGlobal('SpeechSynthesisUtterance', class {});
    render(<TrialOutput {...props} text="" />);
    expect(screen.getByRole('button', { name: 'Speak' })).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Clear' })).toBeDisabled();
  });
});
