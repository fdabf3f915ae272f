/**
 * Composer responsiveness (issue 7): a 200-ply layup typed into the laminate
 * code field in Chromium, timed in the page from the last keystroke to the
 * results showing the new stack (the debounce of the composer, the request,
 * the API's work and the page's redraw of matrices, table and plots).
 * Reference: the API's own time for the same preview (POST /layups/preview)
 * measured from Node in the same run, so the ratio says what the browser adds.
 *
 * Starts its own throwaway stack (test profile) on the ports in the
 * environment, or on bench ports of its own when none are set.
 */
import { launchChromium, signInThroughPage } from '../support/browser.ts';
import { signIn } from '../support/sign-in.ts';
import { startLocalStack } from '../../api/src/local/stack.ts';
import { openNewLayup, resultsReceived, typeCode } from '../browser/support/composer-page.ts';
import { type BenchSection, medianOf } from './bench-types.ts';

const TARGET_MS = 1000;
const RUNS = 7;
const MATERIAL = 'FR-UC300';
/** Two 200-ply codes whose second ply differs, so each run's result is told from the one before. */
const CODES = [
  { code: '[0/45/-45/90]25s', secondPly: 45 },
  { code: '[0/-45/45/90]25s', secondPly: -45 },
];

const BENCH_ENV: Record<string, string> = {
  PLYLEDGER_CLUSTER_NAME: 'bench-composer',
  PLYLEDGER_DB_PORT: '55741',
  PLYLEDGER_API_PORT: '4741',
  PLYLEDGER_AUTH_FAKE_PORT: '4742',
  PLYLEDGER_SMTP_PORT: '4743',
  PLYLEDGER_INBOX_PORT: '4744',
  PLYLEDGER_CLIENT_DIST: 'dist/client-bench/browser',
};

export async function run(): Promise<BenchSection> {
  for (const [name, value] of Object.entries(BENCH_ENV)) process.env[name] ??= value;
  process.env.PLYLEDGER_LOG_LEVEL ??= 'warn';
  const stack = await startLocalStack('test', (line) => console.log(`[bench] ${line}`), { freshDatabase: true, buildClient: true });
  const { browser, close } = await launchChromium();
  try {
    const appUrl = stack.api.url;
    const page = await (await browser.newContext({ viewport: { width: 1400, height: 1000 } })).newPage();
    await signInThroughPage(page, appUrl, 'designer');
    await openNewLayup(page, appUrl, MATERIAL);
    await page.evaluate(`document.querySelector('[data-testid="laminate-code"]')
      .addEventListener('keydown', () => { window.plyledgerLastKeyAt = performance.now(); }, { capture: true })`);

    let turn = 0;
    const keystrokeToResults = async (): Promise<number> => {
      const { code, secondPly } = CODES[turn++ % CODES.length];
      const seen = await resultsReceived(page);
      // A string, not a function: the in-page code must not carry the helpers tsx adds to named functions.
      const shown = page.evaluate<number>(`new Promise((resolve) => {
        const updated = () => {
          const status = document.querySelector('[data-testid="results-status"]');
          const count = document.querySelector('[data-testid="result-ply-count"]')?.textContent?.trim();
          const second = document.querySelector('[data-testid="ply-row-1"]')?.getAttribute('data-theta');
          return status?.getAttribute('data-state') === 'ready' && Number(status.getAttribute('data-received')) > ${seen}
            && count === '200' && Number(second) === ${secondPly};
        };
        const observer = new MutationObserver(() => {
          if (updated()) { observer.disconnect(); resolve(performance.now()); }
        });
        observer.observe(document.body, { attributes: true, childList: true, subtree: true, characterData: true });
      })`);
      // Handled here so a failure while typing cannot leave it unobserved.
      shown.catch(() => undefined);
      await typeCode(page, code);
      const shownAt = await shown;
      const lastKeyAt = await page.evaluate<number>('window.plyledgerLastKeyAt ?? NaN');
      return shownAt - lastKeyAt;
    };
    const pageMs = await medianOf(RUNS, keystrokeToResults, 1);

    const api = await signIn(appUrl, 'designer');
    const materials = (await (await api.api('/api/v1/materials')).json()) as { items: { id: number; code: string }[] };
    const conditions = (await (await api.api('/api/v1/conditions')).json()) as { items: { id: number; code: string }[] };
    const draft = {
      code: CODES[0].code,
      material: {
        materialId: materials.items.find((m) => m.code === MATERIAL)!.id,
        lamina: { source: 'ply-property-set', conditionId: conditions.items.find((c) => c.code === 'RTD')!.id, basis: 'B' },
      },
      settings: { loads: { N: [100, 0, 0], M: [0, 0, 0] }, criteria: ['max-stress', 'tsai-wu', 'hashin'], factorOfSafety: 1.5 },
    };
    const apiMs = await medianOf(RUNS, async () => {
      const started = performance.now();
      const response = await api.api('/api/v1/layups/preview', { method: 'POST', json: draft });
      await response.arrayBuffer();
      if (!response.ok) throw new Error(`preview answered ${response.status}`);
      return performance.now() - started;
    }, 1);

    return {
      name: 'Layup composer in Chromium (200 plies)',
      figures: [
        {
          figure: 'last keystroke to results shown, 200-ply code',
          median: pageMs,
          unit: 'ms',
          runs: RUNS,
          reference: { label: 'API preview of the same stack', median: apiMs, unit: 'ms' },
          ratio: pageMs / apiMs,
          target: `< ${TARGET_MS} ms`,
          met: pageMs < TARGET_MS,
        },
      ],
      notes: [
        'includes the composer\'s 250 ms debounce; the default loads (Nx = 100 N/mm) and three criteria are computed for every ply',
        'timed in the page (performance.now) from the last keydown to the DOM showing the 200-ply result; the polar plot and envelope follow in their own requests and are not waited for',
      ],
    };
  } finally {
    await close();
    await stack.stop();
  }
}
