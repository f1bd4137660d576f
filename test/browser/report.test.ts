// The report page in a real browser: headless Chromium from the Debian package, driven by
// playwright-core. Without /usr/bin/chromium the test fails under CI (the CI script installs
// it) and is skipped, with a note, on a developer machine.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { reportHtml } from '../../src/output/report/index.js';
import { reportFixture } from '../output/report/reportFixture.js';
import { browserTestTitle, launchChromium, skipBrowserTests, watchedPage } from './headlessChromium.js';

describe.skipIf(skipBrowserTests)(browserTestTitle('report page in headless Chromium'), () => {
  const directory = mkdtempSync(join(tmpdir(), 'candela-report-'));
  afterAll(() => rmSync(directory, { recursive: true, force: true }));

  it('loads with no console error and no network request, and every figure has a non-zero box', async () => {
    const file = join(directory, 'report.html');
    writeFileSync(file, reportHtml(reportFixture()));
    const browser = await launchChromium();
    try {
      const { page, problems } = await watchedPage(browser);
      const url = pathToFileURL(file).href;
      page.on('request', (request) => {
        if (request.url() !== url) problems.push(`request: ${request.url()}`);
      });
      await page.goto(url, { waitUntil: 'load' });
      const boxes = await page.$$eval('figure svg', (elements) => elements.map((element) => {
        const box = element.getBoundingClientRect();
        return { width: box.width, height: box.height };
      }));
      expect(boxes).toHaveLength(4);
      for (const box of boxes) {
        expect(box.width).toBeGreaterThan(0);
        expect(box.height).toBeGreaterThan(0);
      }
      // Text inside the figures is laid out too (a font was found): every axis label has a width.
      const labelWidths = await page.$$eval('svg text.axis-label', (elements) => elements.map((element) => (element as unknown as { getBBox(): { width: number } }).getBBox().width));
      expect(labelWidths.length).toBeGreaterThan(0);
      for (const width of labelWidths) expect(width).toBeGreaterThan(0);
      // The page is meant to be read without scripts: the verdict and tables are plain HTML.
      expect(await page.textContent('.verdict')).toContain('convergence checks fail');
      expect(problems).toEqual([]);
    } finally {
      await browser.close();
    }
  }, 90_000);
});
