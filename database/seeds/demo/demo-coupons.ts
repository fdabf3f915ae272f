/**
 * Generates the demo coupon results as a CSV file in the upload template, so
 * the demo data enters Plyledger the way real results do (and carries an
 * upload with a checksum). Deterministic: a seeded pseudo-random generator
 * (mulberry32) and Box-Muller normal deviates, so the file, and its SHA-256,
 * are the same on every run. Spread: a batch offset (SD 2 % of the mean) and
 * the programme's within-batch CV, giving group CVs of about 3-8 %.
 */
import { TEMPLATE_FIELDS, templateHeader } from '../../../api/src/coupons/csv-template.ts';
import { csvCell } from '../../../api/src/shared/csv-cell.ts';
import { mulberry32 } from '../../../api/src/shared/seeded-random.ts';
import { CONDITION_FACTOR, DEMO_CONDITIONS, DEMO_LABORATORY, DEMO_MATERIALS, DEMO_PROGRAMME, type DemoProgramme } from './demo-scenario.ts';

function normalDeviates(uniform: () => number) {
  return () => {
    const u = Math.max(uniform(), 1e-12);
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform());
  };
}

const round = (value: number, digits: number) => Number(value.toFixed(digits));
const shortCode = (material: string) => material.replace(/^FR-/, '');
const PROPERTY_CODE: Record<string, string> = {
  'tension-0': 'T0', 'tension-90': 'T90', 'compression-0': 'C0', 'compression-90': 'C90', 'in-plane-shear': 'S12',
  'short-beam-shear': 'SBS', 'flatwise-tension': 'FWT', 'core-shear': 'CS',
};

function testDate(batch: number, condition: number, index: number): string {
  const day = new Date(Date.UTC(2026, 0, 12) + (batch * 24 + condition * 5 + (index % 3)) * 86_400_000);
  return day.toISOString().slice(0, 10);
}

function couponRows(programme: DemoProgramme, batches: number, plyThicknessMm: number, gauss: () => number): Record<string, string | number>[] {
  const rows: Record<string, string | number>[] = [];
  const batchOffsets = Array.from({ length: batches }, () => 1 + 0.02 * gauss());
  DEMO_CONDITIONS.forEach((condition, ci) => {
    const factor = CONDITION_FACTOR[condition][programme.dominance];
    // moduli change less with temperature and moisture than strengths (invented, typical in direction)
    const modulusFactor = 1 + (factor - 1) * 0.5;
    for (let b = 0; b < batches; b++) {
      const count = programme.specimensPerBatchIn?.[condition] ?? programme.specimensPerBatch;
      for (let i = 0; i < count; i++) {
        const nominalThickness = programme.plyCount * plyThicknessMm;
        const thicknessMm = round(nominalThickness * (1 + 0.015 * gauss()), 3);
        // measured stress of a fibre-dominated property varies inversely with the laminate thickness
        const thicknessEffect = programme.dominance === 'fibre' ? nominalThickness / thicknessMm : 1;
        const strengthMpa = programme.strengthMpa * factor * batchOffsets[b] * (1 + programme.cv * gauss()) * thicknessEffect;
        const widthMm = round(programme.widthMm * (1 + 0.004 * gauss()), 2);
        const area = programme.property === 'short-beam-shear' ? (widthMm * thicknessMm) / 0.75 : widthMm * (programme.dominance === 'core' ? 50 : thicknessMm);
        const id = `${shortCode(programme.material)}-${PROPERTY_CODE[programme.property]}-${condition}-B${b + 1}-${String(i + 1).padStart(2, '0')}`;
        rows.push({
          specimen_id: id,
          material: programme.material,
          batch: `B${b + 1}`,
          panel: `B${b + 1}-${PROPERTY_CODE[programme.property]}-P${1 + (i % 2)}`,
          test_method: programme.testMethod,
          property: programme.property,
          condition,
          width: widthMm,
          thickness: thicknessMm,
          ply_count: programme.plyCount,
          failure_load: round(strengthMpa * area, 0),
          strength: round(strengthMpa, programme.strengthMpa < 10 ? 3 : 1),
          modulus: programme.modulusMpa ? round((programme.modulusMpa * modulusFactor * (1 + 0.02 * gauss()) * thicknessEffect) / 1000, 3) : '',
          poisson_ratio: programme.poissonRatio ? round(programme.poissonRatio * (1 + 0.03 * gauss()), 3) : '',
          failure_strain: programme.failureStrain ? round(programme.failureStrain * factor * (1 + programme.cv * gauss()) * 1e6, 0) : '',
          failure_mode: programme.failureModes ? programme.failureModes[i % programme.failureModes.length] : '',
          test_date: testDate(b, ci, i),
          laboratory: DEMO_LABORATORY,
        });
      }
    }
  });
  return rows;
}

/** The demo coupon file (SI template columns). */
export function demoCouponCsv(): string {
  const gauss = normalDeviates(mulberry32(20261203));
  const header = TEMPLATE_FIELDS.map((f) => templateHeader(f));
  const lines = [header.join(',')];
  for (const programme of DEMO_PROGRAMME) {
    const material = DEMO_MATERIALS.find((m) => m.code === programme.material)!;
    for (const row of couponRows(programme, material.batches, material.nominalCuredPlyThicknessMm, gauss)) {
      lines.push(TEMPLATE_FIELDS.map((f) => csvCell(row[f.field])).join(','));
    }
  }
  return `${lines.join('\r\n')}\r\n`;
}
