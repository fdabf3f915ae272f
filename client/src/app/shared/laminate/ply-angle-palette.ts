/**
 * Plyledger's own colours for ply orientations, used wherever plies are drawn
 * (stack diagram, ply table swatches, legends): 0° a deep fjord blue, ±45° the
 * product's amber (lighter for +45°, darker for -45°, so a swap is visible),
 * 90° moss green, any other angle a muted heather. Each has a text colour that
 * keeps WCAG AA contrast on it.
 */
import { fibreLineDeg } from './ply-angles';

export type AngleFamily = '0' | '+45' | '-45' | '90' | 'other';

export interface AngleSwatch {
  readonly family: AngleFamily;
  readonly label: string;
  readonly fill: string;
  readonly text: string;
}

export const ANGLE_SWATCHES: Readonly<Record<AngleFamily, AngleSwatch>> = {
  '0': { family: '0', label: '0°', fill: '#1d4f6e', text: '#ffffff' },
  '+45': { family: '+45', label: '+45°', fill: '#e0a040', text: '#1f1400' },
  '-45': { family: '-45', label: '-45°', fill: '#9a6212', text: '#ffffff' },
  '90': { family: '90', label: '90°', fill: '#5f8a3c', text: '#ffffff' },
  other: { family: 'other', label: 'other', fill: '#8c7aa6', text: '#ffffff' },
};

export function angleFamily(thetaDeg: number): AngleFamily {
  const line = fibreLineDeg(thetaDeg);
  if (line === 0) return '0';
  if (line === 45) return '+45';
  if (line === -45) return '-45';
  if (line === 90) return '90';
  return 'other';
}

export function angleSwatch(thetaDeg: number): AngleSwatch {
  return ANGLE_SWATCHES[angleFamily(thetaDeg)];
}
