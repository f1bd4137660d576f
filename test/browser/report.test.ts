// The report page in a real browser: headless Chromium from the Debian package, driven by
// playwright-core. Without /usr/bin/chromium the test fails under CI (the CI script installs
// it) and is skipped, with a note, on a developer machine.
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { reportHtml } from '../../src/output/report/index.js';
import { reportFixture } from '../output/report/reportFixture.js';

const CHROMIUM_PATH = '/usr/bin/chromium';
const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const present = existsSync(CHROMIUM_PATH);
const skip = !present && !process.env.CI;
const title = skip
  ? `report page in headless Chromium (SKIPPED: ${CHROMIUM_PATH} is not installed; apt-get install chromium to run it)`
  : 'report page in headless Chromium';
if (skip) console.warn(`note: ${title}`);

describe.skipIf(skip)(title, () => {
  const directory = mkdtempSync(join(tmpdir(), 'candela-report-'));
  afterAll(() => rmSync(directory, { recursive: true, force: true }));

  it('loads with no console error and no network request, and every figure has a non-zero box', async () => {
    if (!present) throw new Error(`CI needs Chromium at ${CHROMIUM_PATH} for the report test (the CI script installs the Debian package "chromium"); it was not found`);
    const file = join(directory, 'report.html');
    writeFileSync(file, reportHtml(reportFixture()));
    const browser = await chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS });
    try {
      const page = await browser.newPage({ viewport: { width: 1100, height: 900 } });
      const problems: string[] = [];
      page.on('console', (message) => {
        if (message.type() === 'error' || message.type() === 'warning') problems.push(`${message.type()}: ${message.text()}`);
      });
      page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
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
