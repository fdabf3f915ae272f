/**
 * In a real browser, the chain of PRODUCT.md from coupon data to an approved
 * allowable: a materials engineer previews a CSV (the browser marks its bad
 * cells), sends it and reads the server's refusal row by row, sends the
 * corrected file with a progress bar, runs an analysis and proposes an
 * allowable; a quality reviewer opens the link of the e-mail, approves it in
 * the confirmation dialog that shows signer, time and meaning; the allowables
 * page then shows it approved, with its history, its chain and the caution.
 * The coupon values are invented for this test (generated below).
 */
import { expect } from 'chai';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { isLocalUrl, launchChromium, signInThroughPage } from '../support/browser.ts';
import { apiUrl, stack } from '../support/stack.ts';

const MATERIAL = 'FR-GX800';
const PROPERTY = 'short-beam-shear';
const CONDITION = 'RTD';
const HEADER =
  'specimen_id,material,batch,panel,test_method,property,condition,width_mm,thickness_mm,ply_count,failure_load_n,' +
  'strength_mpa,modulus_gpa,poisson_ratio,failure_strain_microstrain,failure_mode,test_date,laboratory';
/** MPa in one ksi: 6.894 757 293 168 MPa (NIST SP 811, B.8: 1 psi = 6.894 757 kPa). */
const MPA_PER_KSI = 6.894757293168;

/**
 * 18 invented short-beam strengths, 3 batches of 6, around 46 MPa with a CV
 * near 4 % (a small linear congruential generator and Box-Muller, so every
 * run sends the same file).
 */
function inventedCoupons(): string[] {
  let state = 20261202;
  const uniform = () => {
    state = (state * 1103515245 + 12345) % 2147483648;
    return (state + 0.5) / 2147483648;
  };
  const gauss = () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
  const rows: string[] = [];
  for (const batch of [1, 2, 3]) {
    for (let k = 1; k <= 6; k++) {
      const strength = 45 + batch * 0.8 + 1.8 * gauss();
      const load = (strength * 6.35 * 3.62) / 0.75;
      rows.push(
        [`GX800-SBS-RTD-B${batch}-${String(k).padStart(2, '0')}`, MATERIAL, `B${batch}`, `B${batch}-SBS-P1`, 'ASTM D2344', PROPERTY, CONDITION,
          '6.35', '3.62', '6', load.toFixed(0), strength.toFixed(2), '', '', '', 'INT', `2026-03-1${batch}`, 'Materials laboratory (invented)'].join(','),
      );
    }
  }
  return rows;
}

function csvFile(name: string, rows: string[]) {
  return { name, mimeType: 'text/csv', buffer: Buffer.from(`${HEADER}\n${rows.join('\n')}\n`, 'utf8') };
}

/** The same rows with a decimal comma in row 7 (strength) and an impossible date in row 9. */
function withMistakes(rows: string[]): string[] {
  const broken = [...rows];
  const cells5 = broken[5].split(',');
  broken[5] = [...cells5.slice(0, 11), `"${cells5[11].replace('.', ',')}"`, ...cells5.slice(12)].join(',');
  const cells7 = broken[7].split(',');
  cells7[16] = '2026-02-30';
  broken[7] = cells7.join(',');
  return broken;
}

/** Opens a mat-select through its form field (the floating label covers the select while it is empty). */
async function pick(page: Page, select: string, option: string): Promise<void> {
  await page.locator('mat-form-field', { has: page.locator(`[data-testid="${select}"]`) }).click();
  await page.locator('mat-option', { hasText: option }).first().click();
}

async function apiJson(page: Page, path: string): Promise<any> {
  return page.evaluate(async (p) => (await fetch(p)).json(), path);
}

/** The number shown, read as a number ("2,197" would be a bug: the pages write plain digits). */
function shownNumber(text: string): number {
  const match = /-?\d+(\.\d+)?/.exec(text);
  if (!match) throw new Error(`no number in "${text}"`);
  return Number(match[0]);
}

describe('browser: coupon upload to approved allowable (Chromium)', function () {
  this.timeout(180_000);
  let browser: Browser;
  let close: () => Promise<void>;
  const contexts: BrowserContext[] = [];
  const outside: string[] = [];
  let allowableId = 0;
  let proposedValueMpa = 0;
  const rows = inventedCoupons();

  async function signedInPage(login: string): Promise<Page> {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    contexts.push(context);
    const page = await context.newPage();
    page.setDefaultTimeout(15_000);
    page.on('request', (req) => {
      if (!isLocalUrl(req.url())) outside.push(req.url());
    });
    await signInThroughPage(page, apiUrl(), login);
    return page;
  }

  before(async () => {
    ({ browser, close } = await launchChromium());
  });
  after(async () => {
    for (const context of contexts) await context.close().catch(() => undefined);
    await close?.();
  });

  it('a materials engineer previews a CSV, reads the refusal, uploads the corrected file, runs an analysis and proposes an allowable', async () => {
    const page = await signedInPage('materials');
    await page.goto(`${apiUrl()}/test-data/upload`);

    // The preview marks what the browser can see before sending.
    await page.setInputFiles('[data-testid="upload-file"]', csvFile('gx800-sbs-rtd.csv', withMistakes(rows)));
    await page.locator('[data-testid="upload-preview"]').waitFor();
    expect(await page.locator('[data-testid="upload-facts"]').innerText()).to.include('18 coupon rows');
    expect(await page.locator('[data-testid="preview-bad-cell"]').count(), 'decimal comma and impossible date marked').to.equal(2);
    expect(await page.locator('[data-testid="unit-stress"] .mat-button-toggle-checked').innerText(), 'unit from the header strength_mpa').to.include('MPa');

    // The server refuses the whole file and lists every problem with row and column.
    await page.click('[data-testid="upload-send"]');
    await page.locator('[data-testid="upload-refused"]').waitFor();
    const problems = await page.locator('[data-testid="upload-problem-row"]').allInnerTexts();
    expect(problems).to.have.length(2);
    expect(problems.find((p) => p.includes('strength_mpa')), 'row 7, strength').to.match(/^7\b/);
    expect(problems.find((p) => p.includes('test_date')), 'row 9, test date').to.match(/^9\b/);

    // The corrected file goes through, with the progress bar shown while it is sent and checked.
    await page.setInputFiles('[data-testid="upload-file"]', csvFile('gx800-sbs-rtd.csv', rows));
    await page.locator('[data-testid="upload-refused"]').waitFor({ state: 'detached' });
    expect(await page.locator('[data-testid="preview-bad-cell"]').count()).to.equal(0);
    await page.evaluate(() => {
      const seen = window as unknown as { sawProgress: boolean };
      seen.sawProgress = false;
      new MutationObserver(() => {
        if (document.querySelector('[data-testid="upload-progress"] mat-progress-bar')) seen.sawProgress = true;
      }).observe(document.body, { childList: true, subtree: true });
    });
    await page.click('[data-testid="upload-send"]');
    await page.locator('[data-testid="upload-stored"]').waitFor();
    expect(await page.locator('[data-testid="upload-stored"]').innerText()).to.include('18 coupons stored');
    expect(await page.evaluate(() => (window as unknown as { sawProgress: boolean }).sawProgress), 'progress bar shown').to.equal(true);

    await page.click('[data-testid="upload-see-coupons"]');
    await page.locator('[data-testid="coupon-table"]').waitFor();
    await page.waitForFunction(() => document.querySelector('[data-testid="coupon-count"]')?.textContent?.includes('18 coupons'));

    // Excluding a coupon, and restoring it, each with a reason.
    const specimen = 'GX800-SBS-RTD-B1-01';
    for (const [verb, status] of [['exclude', 'excluded'], ['restore', 'valid']] as const) {
      await page.click(`[data-testid="${verb}-${specimen}"]`);
      await page.fill('[data-testid="status-reason"]', `${verb} check of the browser test`);
      await page.click('[data-testid="status-confirm"]');
      await page.waitForFunction(([code, s]) => document.querySelector(`[data-testid="status-${code}"]`)?.textContent?.trim() === s, [specimen, status]);
    }

    // The analysis of the new data group, chosen in the form.
    await page.click('[data-testid="tab-analyses"]');
    await page.click('[data-testid="new-analysis"]');
    await pick(page, 'analysis-material', MATERIAL);
    await pick(page, 'analysis-property', PROPERTY);
    await page.locator(`[data-testid="analysis-condition-${CONDITION}"] input`).check();
    await page.click('[data-testid="analysis-run"]');
    await page.waitForURL(/\/test-data\/analyses\/\d+$/);
    const analysisId = Number(/(\d+)$/.exec(new URL(page.url()).pathname)![1]);
    await page.locator('[data-testid="b-basis"]').waitFor();
    const analysis = await apiJson(page, `/api/v1/analyses/${analysisId}`);
    expect(analysis.n).to.equal(18);
    expect(shownNumber(await page.locator('[data-testid="b-basis"] .number').innerText())).to.be.closeTo(analysis.bBasis, analysis.bBasis * 1e-3);
    expect(await page.locator('[data-testid="provisional-a"]').count(), 'A-basis from 3 batches and 18 coupons is provisional').to.equal(1);
    expect(await page.locator('[data-testid="diagnostics"]').innerText()).to.match(/batches may( not)? be pooled/);
    expect(await page.locator('[data-testid="batch-scatter"] canvas').count()).to.equal(1);
    expect(await page.locator('[data-testid="distribution-plot"] canvas').count()).to.equal(1);

    // Propose the B-basis value.
    await page.click('[data-testid="propose-allowable"]');
    await page.fill('[data-testid="propose-comment"]', 'Short-beam strength of the invented test batches.');
    await page.click('[data-testid="propose-confirm"]');
    await page.waitForURL(/\/allowables\/\d+$/);
    allowableId = Number(/(\d+)$/.exec(new URL(page.url()).pathname)![1]);
    expect(await page.locator('[data-testid="allowable-status"]').innerText()).to.include('proposed');
    proposedValueMpa = (await apiJson(page, `/api/v1/allowables/${allowableId}`)).value;
    expect(proposedValueMpa).to.be.closeTo(analysis.bBasis, 1e-9);
  });

  it('a quality reviewer opens the e-mailed link and approves with a signed comment', async () => {
    expect(allowableId, 'the proposal of the first test').to.be.greaterThan(0);
    const mail = stack().mail.messages().find((m) => m.to.includes('quality@fjordvik-rotorworks.example') && m.text.includes(`/reviews/${allowableId}`));
    expect(mail, 'the reviewer is told of the proposal').to.not.equal(undefined);
    const link = /https?:\/\/\S+\/reviews\/\d+/.exec(mail!.text)![0];

    const page = await signedInPage('quality');
    await page.goto(`${apiUrl()}${new URL(link).pathname}`);
    await page.locator('[data-testid="review-heading"]').waitFor();
    await page.locator('[data-testid="basis-summary"]').waitFor();
    await page.click('[data-testid="review-approve"]');
    await page.locator('[data-testid="decision-dialog"]').waitFor();
    expect(await page.locator('[data-testid="signature-signer"]').innerText()).to.include('Kari Vollan');
    const detail = await apiJson(page, `/api/v1/allowables/${allowableId}`);
    expect(await page.locator('[data-testid="signature-meaning"]').innerText()).to.include(detail.signatureMeanings.approve);

    // Without the signature box ticked nothing is sent.
    await page.fill('[data-testid="decision-comment"]', 'Data, diagnostics and method checked.');
    await page.click('[data-testid="decision-confirm"]');
    expect((await apiJson(page, `/api/v1/allowables/${allowableId}`)).status).to.equal('proposed');
    await page.locator('[data-testid="decision-sign"] input').check();
    await page.click('[data-testid="decision-confirm"]');
    await page.locator('[data-testid="review-done"]').waitFor();

    const decided = await apiJson(page, `/api/v1/allowables/${allowableId}`);
    expect(decided.status).to.equal('approved');
    expect(decided.reviewer.name).to.equal('Kari Vollan');
    expect(decided.signatureMeaning).to.equal(detail.signatureMeanings.approve);
    expect(decided.decisionComment).to.equal('Data, diagnostics and method checked.');
    const told = stack().mail.messages().find((m) => m.to.includes('materials@fjordvik-rotorworks.example') && m.text.includes(`/allowables/${allowableId}`));
    expect(told, 'the proposer is told of the decision, with a link to the allowable page').to.not.equal(undefined);
  });

  it('the allowables page shows the approved value with its history, its chain and the caution', async () => {
    const page = await signedInPage('materials');
    await page.goto(`${apiUrl()}/allowables`);
    await page.locator(`[data-testid="allowable-${allowableId}"]`).click();
    await page.waitForURL(new RegExp(`/allowables/${allowableId}$`));
    await page.locator('[data-testid="allowable-facts"]').waitFor();

    expect(await page.locator('[data-testid="allowable-status"]').innerText()).to.include('approved');
    expect(await page.locator('[data-testid="engineering-caution"]').isVisible(), 'caution beside the approved value').to.equal(true);
    expect(await page.locator('[data-testid="history-rev-1"]').innerText()).to.include('approved');
    expect(await page.locator('[data-testid="allowable-decision"]').innerText()).to.include('Kari Vollan');
    expect(await page.locator('[data-testid="chain-uploads"]').innerText()).to.include('gx800-sbs-rtd.csv');
    expect(shownNumber(await page.locator('[data-testid="allowable-value"]').innerText())).to.be.closeTo(proposedValueMpa, proposedValueMpa * 1e-3);

    // The US switch shows the same value in ksi.
    await page.click('[data-testid="unit-system"] [data-unit="US"]');
    await page.waitForFunction(() => document.querySelector('[data-testid="allowable-facts"] .unit')?.textContent?.includes('ksi'));
    const ksi = shownNumber(await page.locator('[data-testid="allowable-value"]').innerText());
    expect(ksi).to.be.closeTo(proposedValueMpa / MPA_PER_KSI, (proposedValueMpa / MPA_PER_KSI) * 1e-3);
    await page.click('[data-testid="unit-system"] [data-unit="SI"]');

    // The CSV of approved values carries it, under the caution line.
    await page.goto(`${apiUrl()}/allowables`);
    // The router inserts the page before its first change detection binds the link, so wait for the href.
    const link = await page.waitForFunction(() => document.querySelector('[data-testid="allowables-csv"]')?.getAttribute('href') || null);
    const href = (await link.jsonValue()) as string;
    expect(href).to.match(/\/api\/v1\/allowables\/approved\.csv/);
    const csv = await page.evaluate(async (url) => (await fetch(url)).text(), href);
    expect(csv.split('\n')[0]).to.match(/^# /);
    expect(csv).to.include(MATERIAL).and.to.include(PROPERTY);
  });

  it('made no request outside this machine in any of the above', () => {
    expect(outside).to.deep.equal([]);
  });
});
