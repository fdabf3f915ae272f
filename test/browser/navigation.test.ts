/**
 * In a real browser: each demo account signs in at the stand-in provider's page
 * and sees the navigation of its roles; a viewer cannot reach a quality-only
 * API route; no request leaves the machine (fonts and icons are bundled).
 */
import { expect } from 'chai';
import type { Browser } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../auth-fake/demo-accounts.ts';
import { isLocalUrl, launchChromium, signInThroughPage } from '../support/browser.ts';
import { apiUrl } from '../support/stack.ts';

/** Navigation entries by role, as PRODUCT.md's roles need them (everyone signed in: home and allowables). */
const NAV_BY_ROLE: Record<string, string[]> = {
  'materials-engineer': ['materials', 'test-data'],
  designer: ['materials', 'layups', 'sections'],
  quality: ['materials', 'test-data', 'reviews'],
  analyst: ['layups', 'sections'],
  admin: ['materials', 'administration'],
};
const ORDER = ['home', 'materials', 'test-data', 'allowables', 'reviews', 'layups', 'sections', 'administration'];

function expectedNav(roles: string[]): string[] {
  const entries = new Set(['home', 'allowables', ...roles.flatMap((r) => NAV_BY_ROLE[r] ?? [])]);
  return ORDER.filter((e) => entries.has(e));
}

describe('browser: sign-in and navigation by role (Chromium)', function () {
  this.timeout(90_000);
  let browser: Browser;
  let close: () => Promise<void>;
  const outside: string[] = [];

  before(async () => {
    ({ browser, close } = await launchChromium());
  });
  after(async () => {
    await close?.();
  });

  for (const account of DEMO_ACCOUNTS.filter((a) => a.login !== 'quality2')) {
    it(`${account.login} (${account.roles.join(', ') || 'no role'}) sees exactly the navigation of their roles`, async () => {
      const context = await browser.newContext();
      const page = await context.newPage();
      page.on('request', (req) => {
        if (!isLocalUrl(req.url())) outside.push(req.url());
      });
      try {
        await signInThroughPage(page, apiUrl(), account.login);
        expect(await page.locator('[data-testid="user-name"]').innerText()).to.include(account.name);
        const nav = await page.locator('[data-nav]').evaluateAll((links) => links.map((l) => l.getAttribute('data-nav')));
        expect(nav).to.deep.equal(expectedNav(account.roles));
        const fontsReady = await page.evaluate(async () => {
          await document.fonts.ready;
          return { lato: document.fonts.check('16px Lato'), icons: document.fonts.check('24px "Material Icons"') };
        });
        expect(fontsReady, 'Lato and the icon font are loaded from the bundle').to.deep.equal({ lato: true, icons: true });
      } finally {
        await context.close();
      }
    });
  }

  it('a viewer cannot reach a quality-only API route from the page (403)', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    try {
      await signInThroughPage(page, apiUrl(), 'viewer');
      const status = await page.evaluate(async () => (await fetch('/api/v1/audit-log')).status);
      expect(status).to.equal(403);
      await page.goto(`${apiUrl()}/reviews`);
      await page.locator('[data-testid="not-permitted"]').waitFor();
    } finally {
      await context.close();
    }
  });

  it('signs out through the toolbar and is signed out at the provider too', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    try {
      await signInThroughPage(page, apiUrl(), 'designer');
      await page.click('[data-testid="sign-out"]');
      await page.locator('[data-testid="sign-in"]').first().waitFor();
      expect(page.url().startsWith(apiUrl()), 'back in the application after the provider signed out').to.equal(true);
      const status = await page.evaluate(async () => (await fetch('/api/v1/me')).status);
      expect(status).to.equal(401);
      // Signing in again must ask for the password: the provider's session ended as well.
      await page.locator('[data-testid="sign-in"]').first().click();
      await page.waitForURL(/\/interaction\//);
      expect(await page.locator('#password').count()).to.equal(1);
    } finally {
      await context.close();
    }
  });

  it('made no request outside this machine in any of the above', () => {
    expect(outside).to.deep.equal([]);
  });
});
