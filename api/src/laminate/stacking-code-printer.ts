/**
 * Prints a ply list as the usual laminate code (the notation parsed by
 * stacking-code.ts): symmetric stacks as [half]s with the mid-plane ply of an odd
 * stack marked, others as [...]T; runs of one angle as a_n, adjacent +a/-a as ±a,
 * repeated groups of up to 8 items as (…)n and a repeated whole as [...]ns.
 * Printing then parsing gives the same ply list back.
 */
import { InputError } from '../shared/input-error.ts';

interface Token {
  /** 0: plain angle; 1: ±angle; -1: ∓angle */
  pm: number;
  angle: number;
  count: number;
}

export interface PrintOptions {
  /** how the mid-plane ply of an odd symmetric stack is marked: a bar over the angle (default) or a trailing '*' */
  midPlaneMark?: 'bar' | 'star';
}

function formatAngle(a: number): string {
  return String(a + 0);
}

function formatToken(t: Token): string {
  const head = t.pm === 0 ? formatAngle(t.angle) : `${t.pm > 0 ? '±' : '∓'}${formatAngle(t.angle)}`;
  return t.count > 1 ? `${head}_${t.count}` : head;
}

function sameToken(a: Token, b: Token): boolean {
  return a.pm === b.pm && a.angle === b.angle && a.count === b.count;
}

/** Runs of equal angles, then single +a, -a neighbours as ±a, then runs of equal ± tokens. */
function tokenize(angles: readonly number[]): Token[] {
  const runs: Token[] = [];
  for (const a of angles) {
    const last = runs[runs.length - 1];
    if (last && last.angle === a) last.count++;
    else runs.push({ pm: 0, angle: a, count: 1 });
  }
  const paired: Token[] = [];
  for (let i = 0; i < runs.length; i++) {
    const r = runs[i], next = runs[i + 1];
    if (next && r.count === 1 && next.count === 1 && r.angle !== 0 && next.angle === -r.angle) {
      const token: Token = { pm: r.angle > 0 ? 1 : -1, angle: Math.abs(r.angle), count: 1 };
      const last = paired[paired.length - 1];
      if (last && last.pm === token.pm && last.angle === token.angle) last.count++;
      else paired.push(token);
      i++;
    } else {
      paired.push({ ...r });
    }
  }
  return paired;
}

/** The shortest unit whose repetition is the whole list, and how many times. */
function period(tokens: Token[]): { unit: Token[]; times: number } {
  const n = tokens.length;
  for (let p = 1; p <= n / 2; p++) {
    if (n % p !== 0) continue;
    let ok = true;
    for (let i = p; i < n && ok; i++) ok = sameToken(tokens[i], tokens[i - p]);
    if (ok) return { unit: tokens.slice(0, p), times: n / p };
  }
  return { unit: tokens, times: 1 };
}

/** Longest group looked for by printGrouped: longer repeats are rare in practice and would make printing quadratic. */
const MAX_GROUP_TOKENS = 8;

/** How many times tokens[i, i + length) repeats back to back from i. */
function repeatsAt(tokens: Token[], i: number, length: number): number {
  let times = 1;
  for (;;) {
    const start = i + times * length;
    if (start + length > tokens.length) return times;
    for (let k = 0; k < length; k++) if (!sameToken(tokens[i + k], tokens[start + k])) return times;
    times++;
  }
}

/** Joins tokens with "/", writing runs of a group of 2 to 8 tokens repeated as (…)n; linear in the number of tokens. */
function printGrouped(tokens: Token[]): string {
  const parts: string[] = [];
  for (let i = 0; i < tokens.length; ) {
    let bestLength = 0, bestTimes = 1;
    for (let length = 2; length <= MAX_GROUP_TOKENS && i + 2 * length <= tokens.length; length++) {
      const times = repeatsAt(tokens, i, length);
      if (times > 1 && times * length > bestTimes * bestLength) { bestLength = length; bestTimes = times; }
    }
    if (bestLength > 0) {
      parts.push(`(${printGrouped(tokens.slice(i, i + bestLength))})${bestTimes}`);
      i += bestLength * bestTimes;
    } else {
      parts.push(formatToken(tokens[i]));
      i++;
    }
  }
  return parts.join('/');
}

function markMidPlane(angle: string, mark: 'bar' | 'star'): string {
  return mark === 'star' ? `${angle}*` : [...angle].map((ch) => `${ch}\u0305`).join('');
}

/** The laminate code of a ply list (degrees, first = bottom ply). */
export function printStackingCode(angles: readonly number[], options: PrintOptions = {}): string {
  if (!Array.isArray(angles) || angles.length === 0 || !angles.every((a) => typeof a === 'number' && Number.isFinite(a))) {
    throw new InputError({ field: 'angles', message: 'must be a non-empty list of finite angles in degrees', fix: 'give the ply angles, first ply first' });
  }
  const n = angles.length;
  const symmetric = n >= 2 && angles.every((a, i) => a === angles[n - 1 - i]);
  if (!symmetric) {
    const { unit, times } = period(tokenize(angles));
    return `[${printGrouped(unit)}]${times > 1 ? times : ''}T`;
  }
  const half = angles.slice(0, Math.floor(n / 2));
  if (n % 2 === 1) {
    const mid = markMidPlane(formatAngle(angles[(n - 1) / 2]), options.midPlaneMark ?? 'bar');
    return `[${printGrouped(tokenize(half))}/${mid}]s`;
  }
  const { unit, times } = period(tokenize(half));
  return `[${printGrouped(unit)}]${times > 1 ? times : ''}s`;
}
