import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { findWebAppFonts } from './web-app-fonts';

describe('findWebAppFonts', () => {
  it('finds the hashed Latin regular and bold woff2 files of a build, and nothing else', () => {
    const dir = mkdtempSync(join(tmpdir(), 'keyloom-fonts-'));
    mkdirSync(join(dir, 'assets'));
    for (const name of [
      'atkinson-hyperlegible-latin-400-normal-BrHNak5F.woff2',
      'atkinson-hyperlegible-latin-400-normal-BbWidj28.woff',
      'atkinson-hyperlegible-latin-ext-700-normal-CKkU2Dpt.woff2',
      'atkinson-hyperlegible-latin-700-italic-Zz9.woff2',
      'atkinson-hyperlegible-latin-700-normal-GZI4o3u0.woff2',
    ]) {
      writeFileSync(join(dir, 'assets', name), '');
    }
    expect(findWebAppFonts(dir)).toEqual({
      regular: '/assets/atkinson-hyperlegible-latin-400-normal-BrHNak5F.woff2',
      bold: '/assets/atkinson-hyperlegible-latin-700-normal-GZI4o3u0.woff2',
    });
  });

  it('answers nulls without a build', () => {
    expect(findWebAppFonts(join(tmpdir(), 'keyloom-no-such-build'))).toEqual({ regular: null, bold: null });
  });
});
