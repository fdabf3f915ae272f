/**
 * Debian's Chromium driven by playwright-core, headless, with the flags this
 * closed network needs (no background connections, no component updates).
 * playwright-core gives every launch a fresh, empty profile folder of its own.
 */
import { chromium, type Browser, type Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../auth-fake/demo-accounts.ts';
import { ensureDebianPackage } from '../../api/src/local/debian-package.ts';

export async function launchChromium(): Promise<{ browser: Browser; close: () => Promise<void> }> {
  const executablePath = ensureDebianPackage('chromium', '/usr/bin/chromium');
  const browser = await chromium.launch({
    executablePath,
    headless: true,
    args: [
      '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update',
      '--no-first-run', '--disable-sync', '--disable-quic',
    ],
  });
  return {
    browser,
    close: () => browser.close(),
  };
}

/** True for URLs on this machine (loopback) or in the page itself (data:, blob:). */
export function isLocalUrl(url: string): boolean {
  if (/^(data|blob|about):/.test(url)) return true;
  const { hostname } = new URL(url);
  return hostname === 'localhost' || hostname === '[::1]' || /^127\./.test(hostname);
}

/** Signs in through the real sign-in page of the stand-in provider, starting at the application. */
export async function signInThroughPage(page: Page, appUrl: string, login: string): Promise<void> {
  await page.goto(appUrl);
  await page.locator('[data-testid="sign-in"]').first().click();
  await page.waitForURL(/\/interaction\//);
  await page.fill('#login', login);
  await page.fill('#password', DEMO_PASSWORD);
  await Promise.all([page.waitForURL((url) => url.href.startsWith(appUrl) && !url.pathname.startsWith('/auth/')), page.click('#sign-in')]);
  await page.locator('[data-testid="user-name"]').waitFor();
}
