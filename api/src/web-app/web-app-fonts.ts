import { readdirSync } from 'node:fs';
import { join } from 'node:path';

/** Addresses of the web app's own Atkinson Hyperlegible files (Latin, regular and bold), when built. */
export type WebAppFonts = { regular: string | null; bold: string | null };

/**
 * Finds the font files the built web app serves from /assets (the @fontsource files Vite copies
 * there under a content-hashed name), for pages the API renders itself, such as the stop page.
 * Without a build (the API alone) both are null and those pages fall back to the system font.
 * @param webAppDist the built web app's folder (AppConfig.webAppDist)
 */
export function findWebAppFonts(webAppDist: string): WebAppFonts {
  let files: string[];
  try {
    files = readdirSync(join(webAppDist, 'assets'));
  } catch {
    return { regular: null, bold: null };
  }
  const find = (weight: number) => {
    const file = files.find((name) =>
      new RegExp(`^atkinson-hyperlegible-latin-${weight}-normal-[\\w-]+\\.woff2$`).test(name),
    );
    return file ? `/assets/${file}` : null;
  };
  return { regular: find(400), bold: find(700) };
}
