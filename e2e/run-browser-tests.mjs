// Browser tests: Debian's Chromium driven by playwright-core against a running
// Keyloom (APP_URL) on a migrated, seeded test database. scripts/test.mjs
// starts that app; run by hand with:
//   APP_URL=http://127.0.0.1:3000 node e2e/run-browser-tests.mjs
// Screenshots go to e2e/out/ (git-ignored). Prints "N passed, N failed".
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright-core';
import { AxeBuilder } from '@axe-core/playwright';
import { browserSuites } from './suites/index.mjs';

const here = dirname(fileURLToPath(import.meta.url));
const outDir = join(here, 'out');
const appUrl = (process.env.APP_URL ?? 'http://127.0.0.1:3000').replace(/\/$/, '');
const chromiumPath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const only = process.env.E2E_ONLY ? new RegExp(process.env.E2E_ONLY, 'i') : null;

mkdirSync(outDir, { recursive: true });

const profile = mkdtempSync(join(tmpdir(), 'keyloom-chromium-'));
const context = await chromium.launchPersistentContext(profile, {
  executablePath: chromiumPath,
  headless: true,
  viewport: { width: 1280, height: 860 },
  args: [
    '--no-sandbox',
    '--disable-gpu',
    '--disable-quic',
    '--no-first-run',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
  ],
});

// Nothing may leave the machine: every request must go to the app itself.
const offSite = [];
await context.route('**/*', (route) => {
  const url = route.request().url();
  if (url.startsWith(appUrl) || url.startsWith('data:') || url.startsWith('blob:')) return route.continue();
  offSite.push(url);
  return route.abort();
});

const results = [];
const helpers = {
  appUrl,
  outDir,
  context,
  async newPage() {
    const page = await context.newPage();
    page.setDefaultTimeout(15_000);
    return page;
  },
  /** axe-core scan; returns the serious and critical violations. */
  /**
   * Axe's serious and critical violations on the page. `exclude`: a selector left out, e.g. a frame
   * that runs no scripts (axe cannot run inside it; scan its document on a page of its own instead).
   */
  async seriousViolations(page, label, { exclude } = {}) {
    // WCAG 2.5.3 (label in name): axe tags its rule experimental and leaves it off unless asked. An
    // enabled rule runs whatever the tags; options() replaces every option, so it comes first.
    let builder = new AxeBuilder({ page })
      .options({ rules: { 'label-content-name-mismatch': { enabled: true } } })
      .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']);
    if (exclude) builder = builder.exclude(exclude);
    const report = await builder.analyze();
    const bad = report.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
    for (const v of bad) {
      console.log(`    axe ${label}: ${v.impact} ${v.id}: ${v.help} (${v.nodes.length} nodes)`);
      for (const node of v.nodes.slice(0, 3)) console.log(`      ${node.target.join(' ')}`);
    }
    return bad;
  },
  screenshot(page, name) {
    return page.screenshot({ path: join(outDir, `${name}.png`), fullPage: true });
  },
};

for (const suite of browserSuites) {
  for (const [name, fn] of suite.tests) {
    const title = `${suite.name} › ${name}`;
    if (only && !only.test(title)) continue;
    const started = Date.now();
    try {
      await fn(helpers);
      results.push({ title, ok: true, ms: Date.now() - started });
      console.log(`  ✓ ${title} (${Date.now() - started} ms)`);
    } catch (error) {
      results.push({ title, ok: false, ms: Date.now() - started });
      console.log(
        `  ✗ ${title}\n    ${String(error?.stack ?? error)
          .split('\n')
          .slice(0, 6)
          .join('\n    ')}`,
      );
    }
    for (const page of context.pages().slice(1)) await page.close();
  }
}

if (offSite.length > 0) {
  results.push({ title: 'no request leaves the machine', ok: false, ms: 0 });
  console.log(`  ✗ off-site requests: ${[...new Set(offSite)].join(', ')}`);
} else {
  results.push({ title: 'no request leaves the machine', ok: true, ms: 0 });
}

await context.close();
rmSync(profile, { recursive: true, force: true });

const passed = results.filter((r) => r.ok).length;
const failed = results.length - passed;
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
