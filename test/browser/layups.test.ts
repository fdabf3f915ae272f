/**
 * The designer's composer in a real browser (Chromium): a laminate code typed
 * with a demo material computes through the API; A11 on the page is the API's
 * A11 in the displayed units (SI and US); a ply dragged to another place makes
 * B non-zero; the layup is saved as revision 1; code errors are marked at the
 * character without losing the edits; the reorder buttons work from the keyboard.
 */
import { expect } from 'chai';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchChromium, signInThroughPage } from '../support/browser.ts';
import { signIn, type SignedIn } from '../support/sign-in.ts';
import { apiUrl } from '../support/stack.ts';
import { fromDisplay, toDisplay } from '../../client/src/app/core/units/unit-conversion.ts';
import {
  dragPly, matrixEntry, openNewLayup, plyAngles, resultsReceived, shownNumber, typeCode, waitForResults,
} from './support/composer-page.ts';

/**
 * lbf/in in one N/mm: (25.4 mm/in) / (4.448 221 615 260 5 N/lbf), both from the exact
 * definitions in NIST SP 811 (2008) Appendix B.8 (in = 0.0254 m; lbf = 0.453 592 37 kg × 9.806 65 m/s²).
 */
const LBF_PER_IN_PER_N_PER_MM = 25.4 / (0.45359237 * 9.80665);
const DEMO_MATERIAL = 'FR-UC300';

interface PreviewReply {
  code: string;
  plies: { thetaDeg: number }[];
  analysis: { A: number[][]; B: number[][]; plyCount: number };
}

async function json<T>(response: Response): Promise<T> {
  const body = await response.text();
  if (!response.ok) throw new Error(`${response.status}: ${body}`);
  return JSON.parse(body) as T;
}

/** The lamina choice the composer starts with: the demo material at RTD, B-basis. */
async function demoMaterial(api: SignedIn): Promise<{ materialId: number; lamina: { source: string; conditionId: number; basis: string } }> {
  const materials = await json<{ items: { id: number; code: string }[] }>(await api.api('/api/v1/materials'));
  const conditions = await json<{ items: { id: number; code: string }[] }>(await api.api('/api/v1/conditions'));
  const material = materials.items.find((m) => m.code === DEMO_MATERIAL);
  const rtd = conditions.items.find((c) => c.code === 'RTD');
  if (!material || !rtd) throw new Error(`the demo catalogue has no ${DEMO_MATERIAL} or no RTD`);
  return { materialId: material.id, lamina: { source: 'ply-property-set', conditionId: rtd.id, basis: 'B' } };
}

describe('browser: display units of the composer (client/src/app/core/units)', () => {
  // Conversion factors as printed (7 digits) in NIST SP 811 (2008) Appendix B.8, from memory;
  // the client builds them from the exact definitions, so they agree to the printed digits.
  const printed: [string, Parameters<typeof toDisplay>[1], number, number][] = [
    ['1 ksi = 6.894 757 MPa', 'stress', 6.894757, 1],
    ['1 lbf/in = 175.1268 N/m', 'lineLoad', 0.1751268, 1],
    ['1 lbf = 4.448 222 N', 'stiffnessB', 4.448222, 1],
    ['1 lbf·in = 0.112 984 8 N·m', 'stiffnessD', 112.9848, 1],
    ['1 in = 25.4 mm', 'length', 25.4, 1],
    ['1 lb/in³ = 2.767 990 E+04 kg/m³', 'density', 2.76799e4, 1],
    ['1 lb/ft² = 4.882 428 kg/m²', 'arealMass', 4.882428, 1],
    ['1 Msi = 6894.757 MPa', 'modulus', 6894.757, 1],
  ];
  for (const [what, quantity, internal, us] of printed) {
    it(what, () => {
      expect(toDisplay(internal, quantity, 'US')).to.be.closeTo(us, 1e-6 * us);
      expect(fromDisplay(us, quantity, 'US')).to.be.closeTo(internal, 1e-6 * internal);
    });
  }
  it('temperature readings carry the offset, temperature differences do not (t/°F = 1.8 t/°C + 32)', () => {
    expect(toDisplay(100, 'temperature', 'US')).to.be.closeTo(212, 1e-12);
    expect(toDisplay(-40, 'temperature', 'US')).to.be.closeTo(-40, 1e-12);
    expect(toDisplay(100, 'temperatureDifference', 'US')).to.be.closeTo(180, 1e-12);
    expect(fromDisplay(32, 'temperature', 'US')).to.be.closeTo(0, 1e-12);
  });
});

describe('browser: layup composer (Chromium)', function () {
  this.timeout(180_000);
  let browser: Browser;
  let close: () => Promise<void>;
  let context: BrowserContext;
  let page: Page;
  let api: SignedIn;

  before(async () => {
    ({ browser, close } = await launchChromium());
    context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    page = await context.newPage();
    await signInThroughPage(page, apiUrl(), 'designer');
    api = await signIn(apiUrl(), 'designer');
  });
  after(async () => {
    await context?.close();
    await close?.();
  });

  it('types [45/-45/0/90]s, shows the API\'s A11 in SI and US, drags a ply so B is no longer zero, and saves', async () => {
    await openNewLayup(page, apiUrl(), DEMO_MATERIAL);
    const before = await resultsReceived(page);
    await typeCode(page, '[45/-45/0/90]s');
    await waitForResults(page, before);
    expect(await plyAngles(page)).to.deep.equal([45, -45, 0, 90, 90, 0, -45, 45]);

    const material = await demoMaterial(api);
    const reference = await json<PreviewReply>(await api.api('/api/v1/layups/preview', {
      method: 'POST',
      json: { code: '[45/-45/0/90]s', material: { ...material, thicknessMm: null } },
    }));
    const a11 = reference.analysis.A[0][0];

    const si = shownNumber(await matrixEntry(page, 'A', '11'));
    expect(Math.abs(si.value - a11), `A11 shown ${si.value} N/mm, API ${a11} N/mm`).to.be.at.most(si.rounding);

    await page.locator('[data-testid="unit-system"] [data-unit="US"]').click();
    await page.waitForFunction(() => document.querySelector('[data-testid="matrix-A"] .unit')?.textContent?.trim() === 'lbf/in');
    const us = shownNumber(await matrixEntry(page, 'A', '11'));
    const a11Us = a11 * LBF_PER_IN_PER_N_PER_MM;
    expect(Math.abs(us.value - a11Us), `A11 shown ${us.value} lbf/in, API ${a11Us} lbf/in`).to.be.at.most(us.rounding);
    await page.locator('[data-testid="unit-system"] [data-unit="SI"]').click();
    await page.waitForFunction(() => document.querySelector('[data-testid="matrix-A"] .unit')?.textContent?.trim() === 'N/mm');

    // A symmetric laminate has B = 0 (ENGINEERING.md section 3, exact identity).
    const bBefore = await page.locator('[data-testid^="matrix-B-"]').allInnerTexts();
    expect(bBefore.map((t) => t.trim())).to.deep.equal(Array(9).fill('0'));

    const beforeDrag = await resultsReceived(page);
    await dragPly(page, 0, 1);
    await waitForResults(page, beforeDrag);
    expect(await plyAngles(page)).to.deep.equal([-45, 45, 0, 90, 90, 0, -45, 45]);
    // Swapping the two outer plies of one side breaks the mirror: B16 and B26 appear.
    const b16 = shownNumber(await matrixEntry(page, 'B', '16'));
    expect(Math.abs(b16.value)).to.be.greaterThan(0);
    expect(await page.locator('[data-testid="laminate-code"]').inputValue()).to.not.equal('[45/-45/0/90]s');

    await page.fill('[data-testid="layup-name"]', `Browser quasi-isotropic ${Date.now()}`);
    await page.fill('[data-testid="layup-comment"]', 'outer plies swapped to try bending-twist coupling');
    await page.click('[data-testid="save-revision"]');
    await page.locator('[data-testid="save-message"]', { hasText: 'Saved as revision 1' }).waitFor();
    await page.waitForURL(/\/layups\/\d+\?revision=\d+/);
    const revisionId = Number(new URL(page.url()).searchParams.get('revision'));
    const saved = await json<{ revision: number; plies: { thetaDeg: number }[]; analysis: { B: number[][] } }>(
      await api.api(`/api/v1/layup-revisions/${revisionId}`),
    );
    expect(saved.revision).to.equal(1);
    expect(saved.plies.map((p) => p.thetaDeg)).to.deep.equal([-45, 45, 0, 90, 90, 0, -45, 45]);
    const savedB16 = shownNumber(await matrixEntry(page, 'B', '16'));
    expect(Math.abs(savedB16.value - saved.analysis.B[0][2])).to.be.at.most(savedB16.rounding);
    expect(await page.locator('[data-testid="composer-revision"]').innerText()).to.include('revision 1');
  });

  it('marks a code error at its character and keeps the table of the last good code', async () => {
    await openNewLayup(page, apiUrl(), DEMO_MATERIAL);
    const before = await resultsReceived(page);
    await typeCode(page, '[0/90]s');
    await waitForResults(page, before);
    await typeCode(page, '[0/9x]s');
    await page.locator('[data-testid="laminate-code-error"]').waitFor();
    expect(await page.locator('[data-testid="laminate-code-error-char"]').innerText()).to.equal('x');
    expect(await page.locator('[data-testid="laminate-code"]').inputValue()).to.equal('[0/9x]s');
    expect(await plyAngles(page)).to.deep.equal([0, 90, 90, 0]);
    expect(await page.locator('[data-testid="results-status"]').getAttribute('data-state')).to.equal('error');
  });

  it('moves plies with the keyboard (reorder buttons) and the results follow', async () => {
    await openNewLayup(page, apiUrl(), DEMO_MATERIAL);
    const before = await resultsReceived(page);
    await typeCode(page, '[0/45/90]T');
    await waitForResults(page, before);
    const afterCode = await resultsReceived(page);
    await page.locator('[data-testid="ply-row-0"] [data-testid="ply-move-down"]').focus();
    await page.keyboard.press('Enter');
    await waitForResults(page, afterCode);
    expect(await plyAngles(page)).to.deep.equal([45, 0, 90]);
    expect(await page.locator('[data-testid="stack-ply-0"] title').textContent()).to.include('45°');
  });

  it('computes a 200-ply stack from its code and lists every ply', async () => {
    await openNewLayup(page, apiUrl(), DEMO_MATERIAL);
    const before = await resultsReceived(page);
    await typeCode(page, '[0/45/-45/90]25s');
    await waitForResults(page, before, 60_000);
    expect(await page.locator('[data-testid="result-ply-count"]').innerText()).to.equal('200');
    expect(await page.locator('[data-testid^="ply-row-"]').count()).to.equal(200);
  });

  it('an analyst may compose and read, but is not offered a save', async () => {
    const analystContext = await browser.newContext();
    const analystPage = await analystContext.newPage();
    try {
      await signInThroughPage(analystPage, apiUrl(), 'analyst');
      await openNewLayup(analystPage, apiUrl(), DEMO_MATERIAL);
      const before = await resultsReceived(analystPage);
      await typeCode(analystPage, '[0/90]s');
      await waitForResults(analystPage, before);
      expect(await analystPage.locator('[data-testid="save-panel"]').count()).to.equal(0);
    } finally {
      await analystContext.close();
    }
  });
});
