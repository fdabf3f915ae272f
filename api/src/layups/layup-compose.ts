/**
 * From a draft (ply table with lamina choices) to what the laminate engine
 * computes on: each distinct (material, lamina source) resolved once from the
 * catalogue, each ply given its thickness (override, else the material's
 * nominal cured ply thickness), the engine's input JSON (the same JSON the
 * `plyledger laminate` and `section` commands read) and the analysis. A saved
 * revision is rebuilt through `laminateJsonOf` from its stored snapshot, so the
 * numbers of a revision never move when the catalogue does.
 */
import type { Knex } from 'knex';
import { runEngine } from '../calculations/engine-runner.ts';
import type { LaminateAnalysis, PlyMaterial } from '../laminate/index.ts';
import { InputError, type InputProblem } from '../shared/input-error.ts';
import { allowableUsage, laminaKey, resolveLamina, type ResolvedLamina } from './lamina-sources.ts';
import type { DraftPly, LaminaChoice, LayupDraft, LayupSettings } from './layup-draft.ts';

/** A ply as stored and as sent: its choice and the numbers it was computed on. */
export interface ComposedPly {
  index: number;
  materialId: number;
  materialCode: string;
  thetaDeg: number;
  thicknessMm: number;
  thicknessOverrideMm: number | null;
  lamina: LaminaChoice & { conditionCode: string };
  laminaIndex: number;
}

/** The laminate engine's input: plies with their material data, plus the settings. */
export interface LaminateJson {
  plies: Array<{ material: PlyMaterial; thetaDeg: number; thickness: number }>;
  [setting: string]: unknown;
}

export interface Composition {
  plies: ComposedPly[];
  laminae: ResolvedLamina[];
  settings: LayupSettings;
  laminate: LaminateJson;
  analysis: LaminateAnalysis;
  code: string;
  plyCount: number;
  thicknessMm: number;
  usage: ReturnType<typeof allowableUsage>;
}

/** Where a ply's problem is reported: its row of the table, or the one material of a code. */
function plyPath(draft: Pick<LayupDraft, 'codeGiven'>, index: number): string {
  return draft.codeGiven !== null ? 'material' : `plies[${index}]`;
}

async function resolveLaminae(db: Knex, draft: LayupDraft, problems: InputProblem[]) {
  const byKey = new Map<string, ResolvedLamina | null>();
  const laminae: ResolvedLamina[] = [];
  const ofPly: Array<ResolvedLamina | null> = [];
  for (const [i, ply] of draft.plies.entries()) {
    const key = laminaKey(ply.materialId, ply.lamina);
    if (!byKey.has(key)) {
      const found = await resolveLamina(db, laminae.length, ply.materialId, ply.lamina);
      if ('problem' in found) {
        problems.push({ field: `${plyPath(draft, i)}.${found.field}`, message: found.problem, fix: found.fix });
        byKey.set(key, null);
      } else {
        laminae.push(found);
        byKey.set(key, found);
      }
    }
    ofPly.push(byKey.get(key)!);
  }
  return { laminae, ofPly };
}

function plyThickness(draft: LayupDraft, ply: DraftPly, lamina: ResolvedLamina, i: number, problems: InputProblem[]): number | null {
  const thickness = ply.thicknessOverrideMm ?? lamina.nominalPlyThicknessMm;
  if (thickness === null || !(thickness > 0)) {
    problems.push({ field: `${plyPath(draft, i)}.thicknessMm`, message: `is not given and ${lamina.materialCode} has no nominal cured ply thickness`, fix: 'give the ply thickness in mm' });
    return null;
  }
  return thickness;
}

/** The engine input of a ply list; `transverseShear` and the other settings ride along. */
export function laminateJsonOf(plies: ReadonlyArray<Pick<ComposedPly, 'thetaDeg' | 'thicknessMm' | 'laminaIndex'>>, laminae: ReadonlyArray<Pick<ResolvedLamina, 'values'>>, settings: LayupSettings): LaminateJson {
  return {
    plies: plies.map((p) => ({ material: laminae[p.laminaIndex].values, thetaDeg: p.thetaDeg, thickness: p.thicknessMm })),
    ...settings,
  };
}

/** What the section writers need of a layup: the plies and the shear model, not the loads. */
export function sectionLaminateJson(laminate: LaminateJson): LaminateJson {
  return { plies: laminate.plies, ...(laminate.transverseShear !== undefined ? { transverseShear: laminate.transverseShear } : {}) };
}

/**
 * Engine problems name the engine's input (`plies[3].material.Xt`, `loads.N`);
 * a designer sent lamina choices and settings, so the fields are renamed to
 * theirs (`plies[3].lamina.Xt`, `settings.loads.N`).
 */
function renameEngineProblem(problem: InputProblem, draft: Pick<LayupDraft, 'codeGiven'>, laminaOfPly: (i: number) => ResolvedLamina | undefined): InputProblem {
  const ply = /^plies\[(\d+)\]\.material\.?(.*)$/.exec(problem.field);
  if (ply) {
    const i = Number(ply[1]);
    const lamina = laminaOfPly(i);
    return {
      ...problem,
      field: `${plyPath(draft, i)}.lamina${ply[2] ? `.${ply[2]}` : ''}`,
      message: `${lamina ? `${lamina.values.name}: ` : ''}${ply[2] || 'lamina'} ${problem.message}`,
      fix: `${problem.fix ?? ''}${problem.fix ? '; or ' : ''}choose another lamina source or drop the setting that needs it`,
    };
  }
  if (/^plies(\[|$)/.test(problem.field) || problem.field === 'input') return problem;
  return { ...problem, field: `settings.${problem.field}` };
}

/**
 * Runs the engine on a laminate JSON (through runEngine: inline for a short
 * stack, in the worker pool for a long one), naming problems in the designer's terms.
 */
export async function analyseLaminateJson(laminate: LaminateJson, draft: Pick<LayupDraft, 'codeGiven'>, laminaOfPly: (i: number) => ResolvedLamina | undefined): Promise<LaminateAnalysis> {
  try {
    return await runEngine<LaminateAnalysis>('laminate.analyse', laminate);
  } catch (err) {
    if (err instanceof InputError) throw new InputError(err.problems.map((p) => renameEngineProblem(p, draft, laminaOfPly)));
    throw err;
  }
}

/** Resolves, checks and analyses a draft. Throws one InputError naming every ply and field at fault. */
export async function composeDraft(db: Knex, draft: LayupDraft): Promise<Composition> {
  const problems: InputProblem[] = [];
  const { laminae, ofPly } = await resolveLaminae(db, draft, problems);
  const plies: ComposedPly[] = [];
  draft.plies.forEach((ply, i) => {
    const lamina = ofPly[i];
    if (!lamina) return;
    const thicknessMm = plyThickness(draft, ply, lamina, i, problems);
    if (thicknessMm === null) return;
    plies.push({
      index: i, materialId: ply.materialId, materialCode: lamina.materialCode, thetaDeg: ply.thetaDeg, thicknessMm,
      thicknessOverrideMm: ply.thicknessOverrideMm, lamina: { ...ply.lamina, conditionCode: lamina.conditionCode }, laminaIndex: lamina.index,
    });
  });
  if (problems.length) throw new InputError(dedupe(problems).slice(0, 20));
  const laminate = laminateJsonOf(plies, laminae, draft.settings);
  const analysis = await analyseLaminateJson(laminate, draft, (i) => ofPly[i] ?? undefined);
  return {
    plies, laminae, settings: draft.settings, laminate, analysis,
    code: analysis.stackingCode, plyCount: plies.length, thicknessMm: analysis.thickness, usage: allowableUsage(laminae),
  };
}

/** A code's one material fails once, not once per ply. */
function dedupe(problems: InputProblem[]): InputProblem[] {
  const seen = new Set<string>();
  return problems.filter((p) => {
    const key = `${p.field}|${p.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}
