// The index page of a multi-model fit in a real browser (headless Chromium from the
// Debian package, driven by playwright-core): it loads without console errors or
// requests, every link to a model's report resolves, and every figure on those
// reports has a box. Without /usr/bin/chromium the test fails under CI and is
// skipped, with a note, on a developer machine (as test/browser/report.test.ts).
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { modelsIndexHtml, reportHtml, type ModelColumn } from '../../src/output/index.js';
import { HAND_BUILT_SUMMARY } from '../output/tables/handBuiltSummary.js';
import { reportFixture } from '../output/report/reportFixture.js';
import { browserTestTitle, launchChromium, skipBrowserTests, watchedPage } from './headlessChromium.js';

const LABELS = ['flat_lcdm', 'flat_wcdm'];

describe.skipIf(skipBrowserTests)(browserTestTitle('models index page in headless Chromium'), () => {
  const directory = mkdtempSync(join(tmpdir(), 'candela-index-'));
  afterAll(() => rmSync(directory, { recursive: true, force: true }));

  it('loads cleanly, and every model link opens a report whose figures all load', async () => {
    const models: ModelColumn[] = LABELS.map((label, k) => ({
      label, link: `${label}/report.html`, parameters: HAND_BUILT_SUMMARY.parameters.slice(0, 2 + k),
      chiSquare: 1030 - 2 * k, degreesOfFreedom: 1000 - k, pValue: 0.25, aic: 1034 - 2 * k + 2 * k, bic: 1043 + k, warningCount: k,
    }));
    for (const label of LABELS) {
      mkdirSync(join(directory, label));
      writeFileSync(join(directory, label, 'report.html'), reportHtml(reportFixture()));
    }
    const index = join(directory, 'index.html');
    writeFileSync(index, modelsIndexHtml({ title: 'Lyra Deep Survey: models', version: '0.1.0', models }));
    const browser = await launchChromium();
    try {
      const { page, problems } = await watchedPage(browser);
      page.on('requestfailed', (request) => problems.push(`failed: ${request.url()}`));
      await page.goto(pathToFileURL(index).href, { waitUntil: 'load' });
      const links = await page.$$eval('#models thead a', (anchors) => anchors.map((anchor) => (anchor as unknown as { href: string }).href));
      expect(links).toHaveLength(LABELS.length);
      for (const link of links) {
        const response = await page.goto(link, { waitUntil: 'load' });
        expect(response?.ok(), link).toBe(true);
        const boxes = await page.$$eval('figure svg', (elements) => elements.map((element) => element.getBoundingClientRect().width * element.getBoundingClientRect().height));
        expect(boxes.length).toBeGreaterThan(0);
        for (const area of boxes) expect(area).toBeGreaterThan(0);
      }
      expect(problems).toEqual([]);
    } finally {
      await browser.close();
    }
  }, 90_000);
});
