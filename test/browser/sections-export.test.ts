/**
 * The analyst's section export in a real browser (Chromium): a designer's
 * saved layup revision is exported as CalculiX and Nastran PCOMP sections; the
 * preview shows the checks and the caution; each downloaded file equals what
 * `plyledger section` prints for the same laminate and options; both exports
 * are recorded and listed. When an allowable a revision was computed on is
 * superseded, the composer and the export page show a banner naming it, and the
 * allowable's impact lists the revision and the export.
 */
import { execFile } from 'node:child_process';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { expect } from 'chai';
import type { Browser, Page } from 'playwright-core';
import { repoRoot } from '../../api/src/local/stack.ts';
import { launchChromium, signInThroughPage } from '../support/browser.ts';
import { signIn, type SignedIn } from '../support/sign-in.ts';
import { apiUrl } from '../support/stack.ts';

const run = promisify(execFile);

interface Revision {
  id: number;
  layupId: number;
  name: string;
  revision: number;
  laminate: { plies: unknown[]; transverseShear?: unknown };
}

interface ExportDetail {
  id: number;
  format: string;
  units: string;
  fileName: string;
  date: string;
  allowablesText: string;
  options: { propertyId: number; materialId: number; elset: string; referenceOffset: number; freeField: boolean };
}

async function json<T>(response: Response): Promise<T> {
  const body = await response.text();
  if (!response.ok) throw new Error(`${response.status}: ${body}`);
  return JSON.parse(body) as T;
}

/** A designer saves [45/-45/0/90]s of the demo tape at RTD, B-basis (through the API, as the composer would). */
async function savedLayup(designer: SignedIn): Promise<Revision> {
  const materials = await json<{ items: { id: number; code: string }[] }>(await designer.api('/api/v1/materials'));
  const conditions = await json<{ items: { id: number; code: string }[] }>(await designer.api('/api/v1/conditions'));
  const material = materials.items.find((m) => m.code === 'FR-UC300')!;
  const rtd = conditions.items.find((c) => c.code === 'RTD')!;
  return json<Revision>(await designer.api('/api/v1/layups', {
    method: 'POST',
    json: {
      name: `Export check ${Date.now()}`,
      code: '[45/-45/0/90]s',
      material: { materialId: material.id, lamina: { source: 'ply-property-set', conditionId: rtd.id, basis: 'B' } },
    },
  }));
}

/** A materials engineer proposes a B-basis allowable from the demo coupons and a quality reviewer approves it. */
async function approvedAllowable(engineer: SignedIn, reviewer: SignedIn, materialId: number, property: string, condition: string): Promise<{ id: number }> {
  const analysis = await json<{ id: number }>(await engineer.api('/api/v1/analyses', {
    method: 'POST', json: { materialId, property, conditions: [condition], basis: 'B' },
  }));
  const proposed = await json<{ id: number; signatureMeanings: { approve: string } }>(await engineer.api('/api/v1/allowables', {
    method: 'POST', json: { analysisId: analysis.id, basis: 'B', submit: true },
  }));
  return json<{ id: number }>(await reviewer.api(`/api/v1/allowables/${proposed.id}/approve`, {
    method: 'POST', json: { comment: 'coupons and diagnostics checked', signatureMeaning: proposed.signatureMeanings.approve },
  }));
}

/** What the command line prints for the same laminate and the options the export recorded. */
async function cliOutput(revision: Revision, detail: ExportDetail): Promise<string> {
  const dir = await mkdtemp(path.join(os.tmpdir(), 'plyledger-export-'));
  try {
    const file = path.join(dir, 'laminate.json');
    const { plies, transverseShear } = revision.laminate;
    await writeFile(file, JSON.stringify({ plies, ...(transverseShear !== undefined ? { transverseShear } : {}) }));
    const o = detail.options;
    const args = [
      'run', '--silent', 'cli', '--', 'section', '--format', detail.format, '--units', detail.units,
      '--elset', o.elset, '--pid', String(o.propertyId), '--mid', String(o.materialId), '--offset', String(o.referenceOffset),
      ...(o.freeField ? ['--free-field'] : []),
      '--name', revision.name, '--revision', String(revision.revision), '--allowables', detail.allowablesText, '--date', detail.date,
      file,
    ];
    const { stdout } = await run('npm', args, { cwd: repoRoot, maxBuffer: 16 * 1024 * 1024 });
    return stdout;
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

async function chooseFormat(page: Page, format: string, marker: string): Promise<void> {
  await page.click('[data-testid="export-format"]');
  await page.click(`[data-testid="format-${format}"]`);
  await page.locator('[data-testid="export-preview"]', { hasText: marker }).waitFor();
  await page.locator('[data-testid="export-download"]:not([disabled])').waitFor();
}

async function download(page: Page): Promise<{ name: string; text: string }> {
  const [file] = await Promise.all([page.waitForEvent('download'), page.click('[data-testid="export-download"]')]);
  const where = await file.path();
  return { name: file.suggestedFilename(), text: await readFile(where, 'utf8') };
}

describe('browser: section export (Chromium)', function () {
  this.timeout(180_000);
  let browser: Browser;
  let close: () => Promise<void>;
  let revision: Revision;
  let analyst: SignedIn;

  before(async () => {
    ({ browser, close } = await launchChromium());
    revision = await savedLayup(await signIn(apiUrl(), 'designer'));
    analyst = await signIn(apiUrl(), 'analyst');
  });
  after(async () => {
    await close?.();
  });

  it('an analyst downloads the CalculiX and Nastran PCOMP sections, each equal to the CLI output, and both are recorded', async () => {
    const context = await browser.newContext({ acceptDownloads: true, viewport: { width: 1400, height: 1100 } });
    const page = await context.newPage();
    try {
      await signInThroughPage(page, apiUrl(), 'analyst');
      await page.goto(`${apiUrl()}/sections?layup=${revision.layupId}&revision=${revision.id}`);
      await page.locator('[data-testid="export-preview"]', { hasText: '*SHELL SECTION' }).waitFor();
      await page.locator('[data-testid="export-download"]:not([disabled])').waitFor();
      expect(await page.locator('[data-testid="engineering-caution"]').isVisible()).to.equal(true);
      // The strip check compares beam elements with the closed form: cubic Hermite elements are exact for a tip load.
      const stripRatio = Number(await page.locator('[data-testid="check-strip-ratio"]').innerText());
      expect(stripRatio).to.be.closeTo(1, 1e-4);
      expect(await page.locator('[data-testid="check-plate"]').isVisible()).to.equal(true);

      const calculix = await download(page);
      expect(calculix.name).to.match(/calculix.*\.inp$/);
      await chooseFormat(page, 'nastran-pcomp', 'PCOMP');
      const pcomp = await download(page);
      expect(pcomp.name).to.match(/nastran-pcomp.*\.bdf$/);
      await page.locator('[data-testid="export-history"] tbody tr').nth(1).waitFor();

      const list = await json<{ items: { id: number; format: string }[] }>(
        await analyst.api(`/api/v1/exports?layupRevisionId=${revision.id}`),
      );
      expect(list.items.map((e) => e.format)).to.deep.equal(['nastran-pcomp', 'calculix']);
      for (const [item, downloaded] of [[list.items[1], calculix], [list.items[0], pcomp]] as const) {
        const detail = await json<ExportDetail>(await analyst.api(`/api/v1/exports/${item.id}`));
        expect(downloaded.name).to.equal(detail.fileName);
        expect(downloaded.text, `${detail.format} download against the CLI`).to.equal(await cliOutput(revision, detail));
      }
      expect(calculix.text).to.include('*SHELL SECTION');
      expect(pcomp.text).to.include('PCOMP');
    } finally {
      await context.close();
    }
  });

  it('a superseded allowable puts a banner on the layup revision and its export, and its impact lists both', async () => {
    const engineer = await signIn(apiUrl(), 'materials');
    const reviewer = await signIn(apiUrl(), 'quality');
    const designer = await signIn(apiUrl(), 'designer');
    const materials = await json<{ items: { id: number; code: string }[] }>(await designer.api('/api/v1/materials'));
    const conditions = await json<{ items: { id: number; code: string }[] }>(await designer.api('/api/v1/conditions'));
    const material = materials.items.find((m) => m.code === 'FR-UC300')!;
    const etd = conditions.items.find((c) => c.code === 'ETD')!;
    // Elevated-temperature compression: a data group the other suites leave alone.
    const first = await approvedAllowable(engineer, reviewer, material.id, 'compression-0', 'ETD');
    const used = await json<Revision & { allowables: { allowableId: number }[] }>(await designer.api('/api/v1/layups', {
      method: 'POST',
      json: {
        name: `Impact check ${Date.now()}`,
        code: '[0/90]s',
        material: { materialId: material.id, lamina: { source: 'ply-property-set', conditionId: etd.id, basis: 'B' } },
      },
    }));
    expect(used.allowables.map((a) => a.allowableId)).to.include(first.id);
    const exported = await analyst.api('/api/v1/exports', { method: 'POST', json: { layupRevisionId: used.id, format: 'calculix' } });
    expect(exported.status).to.equal(201);
    const exportId = Number(exported.headers.get('X-Export-Id'));
    const second = await approvedAllowable(engineer, reviewer, material.id, 'compression-0', 'ETD');

    const context = await browser.newContext({ viewport: { width: 1400, height: 1100 } });
    const page = await context.newPage();
    try {
      await signInThroughPage(page, apiUrl(), 'analyst');
      await page.goto(`${apiUrl()}/layups/${used.layupId}?revision=${used.id}`);
      const layupBanner = page.locator('[data-testid="impact-banner"]');
      await layupBanner.waitFor();
      expect(await layupBanner.innerText()).to.include('compression-0').and.to.include(`allowable ${second.id}`);
      await page.goto(`${apiUrl()}/sections?layup=${used.layupId}&revision=${used.id}`);
      await page.locator('[data-testid="export-preview"]').waitFor();
      expect(await page.locator('[data-testid="impact-banner"]').innerText()).to.include('superseded');
      await page.locator(`[data-testid="export-${exportId}"] mat-icon`).waitFor();

      const impact = await json<{ status: string; supersededBy: number; layups: { revisionId: number }[]; exports: { id: number }[] }>(
        await analyst.api(`/api/v1/allowables/${first.id}/impact`),
      );
      expect(impact.status).to.equal('superseded');
      expect(impact.supersededBy).to.equal(second.id);
      expect(impact.layups.map((l) => l.revisionId)).to.include(used.id);
      expect(impact.exports.map((e) => e.id)).to.include(exportId);
    } finally {
      await context.close();
    }
  });
});
