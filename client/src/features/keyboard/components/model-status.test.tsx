import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { ModelDownloadInfo } from '../engine/use-keyboard-engine';
import { ModelStatus } from './model-status';

const info: ModelDownloadInfo = {
  versionBytes: 96_784,
  versionCompressedBytes: 50_174,
  baseBytes: 2_855_143,
  baseCompressedBytes: 1_757_664,
  baseWordsBytes: 2_374_731,
  baseWordsCompressedBytes: 1_258_908,
  loadMs: 683.4,
  order: 5,
  contexts: 1234,
};

describe('ModelStatus', () => {
  it('lists each download with its sizes, the base vocabulary included', () => {
    render(<ModelStatus status="ready" error={null} info={info} />);
    const list = screen.getByLabelText('Model download');
    expect(list.tagName).toBe('DL');
    const row = (term: string) => within(list).getByText(term).nextElementSibling?.textContent;
    expect(row('This version')).toBe('50.2 kB downloaded (96.8 kB unpacked)');
    expect(row('General English model')).toBe(
      '1.76 MB downloaded (2.86 MB unpacked); fetched once per browser session',
    );
    expect(row('General English words')).toBe(
      '1.26 MB downloaded (2.37 MB unpacked); fetched once per browser session',
    );
    expect(list).toHaveAttribute('data-base-words-compressed-bytes', '1258908');
  });

  it('says when a version uses no base vocabulary', () => {
    render(
      <ModelStatus
        status="ready"
        error={null}
        info={{ ...info, baseWordsBytes: 0, baseWordsCompressedBytes: 0 }}
      />,
    );
    const term = screen.getByText('General English words');
    expect(term.nextElementSibling).toHaveTextContent('Not used by this version.');
  });
});
