/**
 * The layup composer as the browser tests and the composer bench drive it:
 * through the data-testid hooks of client/src/app/pages/layups/composer.
 */
import type { Page } from 'playwright-core';

/** Results counter of the composer: increases by one for every preview the page shows. */
export async function resultsReceived(page: Page): Promise<number> {
  return Number((await page.locator('[data-testid="results-status"]').getAttribute('data-received')) ?? '0');
}

/** Waits until the page shows a preview newer than `after` and no request is pending. */
export async function waitForResults(page: Page, after: number, timeout = 30_000): Promise<void> {
  await page.waitForFunction(
    (n) => {
      const status = document.querySelector('[data-testid="results-status"]');
      return status !== null && Number(status.getAttribute('data-received')) > n && status.getAttribute('data-state') === 'ready';
    },
    after,
    { timeout },
  );
}

/** Opens a new layup and picks a material from the picker by its catalogue code. */
export async function openNewLayup(page: Page, appUrl: string, materialCode: string): Promise<void> {
  await page.goto(`${appUrl}/layups/new`);
  await page.locator(`[data-testid="material-option-${materialCode}"]`).click();
  await page.locator(`[data-testid="material-option-${materialCode}"][aria-selected="true"]`).waitFor();
}

/** Replaces the laminate code by typing it, as a person would (one keystroke per character). */
export async function typeCode(page: Page, code: string): Promise<void> {
  const field = page.locator('[data-testid="laminate-code"]');
  await field.click();
  await field.press('Control+A');
  await field.press('Delete');
  await field.pressSequentially(code);
}

/** The number a cell shows, and half a unit of its last digit (what display rounding can hide). */
export function shownNumber(text: string): { value: number; rounding: number } {
  const trimmed = text.trim();
  const value = Number(trimmed);
  if (!Number.isFinite(value)) throw new Error(`"${trimmed}" is not a number`);
  const [mantissa, exponent] = trimmed.split(/e/i);
  const decimals = mantissa.includes('.') ? mantissa.split('.')[1].length : 0;
  return { value, rounding: 0.5 * 10 ** (-decimals + Number(exponent ?? 0)) };
}

export async function matrixEntry(page: Page, matrix: string, ij: string): Promise<string> {
  return page.locator(`[data-testid="matrix-${matrix}-${ij}"]`).innerText();
}

export async function plyAngles(page: Page): Promise<number[]> {
  return page
    .locator('[data-testid^="ply-row-"]')
    .evaluateAll((rows) => rows.map((row) => Number(row.getAttribute('data-theta'))));
}

/** Drags ply `from` by its handle onto the place of ply `to` (CDK drag and drop follows the pointer). */
export async function dragPly(page: Page, from: number, to: number): Promise<void> {
  const handle = page.locator(`[data-testid="ply-row-${from}"] [data-testid="ply-drag-handle"]`);
  const target = page.locator(`[data-testid="ply-row-${to}"]`);
  // Away from the window's edges, where the drop list would scroll the page under the pointer.
  await handle.evaluate((element) => element.scrollIntoView({ block: 'center' }));
  const start = await handle.boundingBox();
  const end = await target.boundingBox();
  if (!start || !end) throw new Error('the ply rows are not on screen');
  const x = start.x + start.width / 2;
  await page.mouse.move(x, start.y + start.height / 2);
  await page.mouse.down();
  // Past the drag threshold first, then over the lower part of the target row.
  await page.mouse.move(x, start.y + start.height / 2 + 8, { steps: 4 });
  const y = end.y + end.height * (to > from ? 0.65 : 0.35);
  await page.mouse.move(x, y, { steps: 12 });
  await page.mouse.up();
}
