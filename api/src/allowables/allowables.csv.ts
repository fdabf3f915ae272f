/**
 * The approved allowables as a CSV download. The first line is the caution of
 * PRODUCT.md as a comment (# ...), so it travels with the numbers.
 */
import { csvCell } from '../shared/csv-cell.ts';
import type { Allowable } from './allowables.wire.ts';
import { ENGINEERING_CAUTION } from './allowables.wire.ts';

const COLUMNS: Array<[string, (a: Allowable) => string | number | boolean | null]> = [
  ['material', (a) => a.material.code],
  ['property', (a) => a.property],
  ['quantity', (a) => a.quantity],
  ['condition', (a) => a.condition.code],
  ['basis', (a) => a.basis],
  ['value', (a) => a.value],
  ['unit', (a) => a.unit],
  ['revision', (a) => a.revision],
  ['method', (a) => a.method],
  ['provisional', (a) => a.provisional],
  ['analysis_id', (a) => a.analysisId],
  ['allowable_id', (a) => a.id],
  ['proposed_by', (a) => a.proposer.name],
  ['approved_by', (a) => a.reviewer?.name ?? null],
  ['approved_at', (a) => (a.decidedAt ? new Date(a.decidedAt).toISOString() : null)],
];

export function approvedAllowablesCsv(items: Allowable[]): string {
  const lines = [`# ${ENGINEERING_CAUTION}`, COLUMNS.map(([name]) => name).join(',')];
  for (const a of items) lines.push(COLUMNS.map(([, pick]) => csvCell(pick(a))).join(','));
  return `${lines.join('\r\n')}\r\n`;
}
