// Test helper (not a test): headless Chromium from the Debian package, driven by playwright-core,
// and a page that records every console error or warning and page error it meets.
import { existsSync } from 'node:fs';
import { chromium, type Browser, type Page } from 'playwright-core';

export const CHROMIUM_PATH = '/usr/bin/chromium';
const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
/** Chromium is installed here. */
export const chromiumPresent = existsSync(CHROMIUM_PATH);
/** Browser tests are skipped only off CI without Chromium (CI must have it). */
export const skipBrowserTests = !chromiumPresent && !process.env.CI;

/**
 * The describe title of a browser test, saying when and why it is skipped (and printing a note then).
 * @param what what the test checks, e.g. 'report page in headless Chromium'.
 */
export function browserTestTitle(what: string): string {
  if (!skipBrowserTests) return what;
  const title = `${what} (SKIPPED: ${CHROMIUM_PATH} is not installed; apt-get install chromium to run it)`;
  console.warn(`note: ${title}`);
  return title;
}

/** Launches Chromium; throws the CI explanation when it is missing. */
export async function launchChromium(): Promise<Browser> {
  if (!chromiumPresent) throw new Error(`CI needs Chromium at ${CHROMIUM_PATH} for the browser tests (the CI script installs the Debian package "chromium"); it was not found`);
  return chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS });
}

/** A new page whose console errors and warnings and page errors are collected in `problems`. */
export async function watchedPage(browser: Browser): Promise<{ page: Page; problems: string[] }> {
  const page = await browser.newPage({ viewport: { width: 1100, height: 900 } });
  const problems: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error' || message.type() === 'warning') problems.push(`${message.type()}: ${message.text()}`);
  });
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  return { page, problems };
}
