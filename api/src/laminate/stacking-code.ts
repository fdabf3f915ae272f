/**
 * The usual laminate code (laminate orientation code
 * as in Kaw chapter 4 and CMH-17 volume 3; common practice), parsed to a ply list and printed from one.
 *
 *   [0/±45/90]2s   plies listed from the first (bottom, z = -h/2) ply; "/" between
 *                  plies; ±a is +a/-a and ∓a is -a/+a; a_n (or aₙ) is n plies of a;
 *                  (…)n or (…)_n repeats a group; after "]": a repeat count, then
 *                  "s" for symmetric (mirrored about the mid-plane) or "T" for the
 *                  total stack (the default).
 *   [0/45/90*]s    a "*" or a bar over the angle (combining overline U+0305 or macron
 *                  U+0304) marks the mid-plane ply of an odd symmetric laminate: it
 *                  is not mirrored.
 * ±a_n means (±a)_n. Angles may carry a sign (+, -, −) and a degree sign.
 * Errors say where (1-based character position) and what was expected.
 */
import { InputError } from '../shared/input-error.ts';
import { MAX_PLIES } from './ply-checks.ts';

type Item =
  | { kind: 'ply'; angles: number[]; count: number; mid: boolean; at: number }
  | { kind: 'group'; items: Item[]; count: number; at: number };

const BARS = new Set(['\u0305', '\u0304']);
const SUBSCRIPT_DIGITS = '₀₁₂₃₄₅₆₇₈₉';

function fail(code: string, at: number, message: string): never {
  throw new InputError({ field: 'code', position: at, message: `position ${at + 1} of "${code}": ${message}`, fix: 'write the code like [0/±45/90]2s, [45/-45/0_2/90]s or [(0/90)2/45]T' });
}

class CodeParser {
  i = 0;
  constructor(readonly code: string) {}

  found(): string {
    return this.i >= this.code.length ? 'the end of the code' : `'${this.code[this.i]}'`;
  }
  skipSpace(): void {
    while (this.i < this.code.length && /\s/.test(this.code[this.i])) this.i++;
  }
  peek(): string {
    return this.code[this.i] ?? '';
  }
  expect(ch: string, what: string): void {
    this.skipSpace();
    if (this.peek() !== ch) fail(this.code, this.i, `expected ${what} but found ${this.found()}`);
    this.i++;
  }

  sequence(): Item[] {
    const items: Item[] = [this.item()];
    for (;;) {
      this.skipSpace();
      if (this.peek() !== '/') return items;
      this.i++;
      items.push(this.item());
    }
  }

  item(): Item {
    this.skipSpace();
    const at = this.i;
    if (this.peek() === '(') {
      this.i++;
      const items = this.sequence();
      this.expect(')', "'/' or ')'");
      return { kind: 'group', items, count: this.count(true), at };
    }
    const pm = this.plusMinus();
    const angle = this.angle(pm !== 0);
    let mid = this.midMark();
    const count = this.count(false);
    mid = this.midMark() || mid;
    const angles = pm === 0 ? [angle] : [pm * angle, -pm * angle];
    return { kind: 'ply', angles, count, mid, at };
  }

  /** +1 for ±, -1 for ∓, 0 for neither. */
  plusMinus(): number {
    const c = this.code;
    if (c[this.i] === '±') { this.i++; return 1; }
    if (c[this.i] === '∓') { this.i++; return -1; }
    if ((c.startsWith('+-', this.i) || c.startsWith('-+', this.i)) && /[0-9.]/.test(c[this.i + 2] ?? '')) {
      const sign = c[this.i] === '+' ? 1 : -1;
      this.i += 2;
      return sign;
    }
    return 0;
  }

  angle(afterPlusMinus: boolean): number {
    const c = this.code;
    const start = this.i;
    let sign = 1;
    if (/[-+−]/.test(c[this.i] ?? '')) {
      if (afterPlusMinus) fail(c, this.i, 'expected an angle without a sign after ± or ∓');
      sign = c[this.i] === '+' ? 1 : -1;
      this.i++;
    }
    const numberAt = this.i;
    let text = '';
    while (this.i < c.length && (/[0-9.]/.test(c[this.i]) || BARS.has(c[this.i]))) {
      if (BARS.has(c[this.i])) this.barSeen = true;
      else text += c[this.i];
      this.i++;
    }
    const exponent = /^[eE][-+]?[0-9]+/.exec(c.slice(this.i));
    if (text && exponent) { text += exponent[0]; this.i += exponent[0].length; }
    if (!/^([0-9]+\.?[0-9]*|\.[0-9]+)([eE][-+]?[0-9]+)?$/.test(text)) {
      this.i = numberAt;
      const alternatives = start === numberAt && !afterPlusMinus ? ", '(' or '±'" : '';
      fail(c, numberAt, `expected an angle in degrees${alternatives} but found ${this.found()}`);
    }
    if (c[this.i] === '°') this.i++;
    return sign * Number(text) + 0;
  }

  barSeen = false;

  midMark(): boolean {
    if (this.peek() === '*') { this.i++; return true; }
    let bar = this.barSeen;
    this.barSeen = false;
    while (BARS.has(this.peek())) { this.i++; bar = true; }
    return bar;
  }

  /** A repeat count: _n, _{n}, subscript digits, or (where `bare`) plain digits. 1 when absent. */
  count(bare: boolean): number {
    const c = this.code;
    const at = this.i;
    let text = '';
    if (c[this.i] === '_') {
      this.i++;
      const braced = c[this.i] === '{';
      if (braced) this.i++;
      while (/[0-9]/.test(c[this.i] ?? '')) text += c[this.i++];
      if (!text) fail(c, this.i, `expected a repeat count after '_' but found ${this.found()}`);
      if (braced) this.expect('}', "'}'");
    } else if (SUBSCRIPT_DIGITS.includes(c[this.i] ?? '\0')) {
      while (SUBSCRIPT_DIGITS.includes(c[this.i] ?? '\0')) text += String(SUBSCRIPT_DIGITS.indexOf(c[this.i++]));
    } else if (bare) {
      while (/[0-9]/.test(c[this.i] ?? '')) text += c[this.i++];
    }
    if (!text) return 1;
    const n = Number(text);
    if (n < 1) fail(c, at, 'a repeat count must be at least 1');
    if (n > MAX_PLIES) fail(c, at, `a repeat count of ${n} is more than the ${MAX_PLIES} plies a laminate may have`);
    return n;
  }
}

/** Number of plies an item list expands to, capped just above MAX_PLIES so huge codes cannot blow up. */
function expandedSize(items: Item[]): number {
  let size = 0;
  for (const it of items) {
    const one = it.kind === 'ply' ? it.angles.length : expandedSize(it.items);
    size += one * it.count;
    if (size > MAX_PLIES) return MAX_PLIES + 1;
  }
  return size;
}

function expand(items: Item[], out: number[]): number[] {
  for (const it of items) {
    for (let r = 0; r < it.count; r++) {
      if (it.kind === 'ply') out.push(...it.angles);
      else expand(it.items, out);
    }
  }
  return out;
}

function findMidMarks(items: Item[], out: Item[]): Item[] {
  for (const it of items) {
    if (it.kind === 'ply' && it.mid) out.push(it);
    else if (it.kind === 'group') findMidMarks(it.items, out);
  }
  return out;
}

/** Ply angles in degrees, first (bottom) ply first, from a laminate code. Throws InputError (field 'code'). */
export function parseStackingCode(code: string): number[] {
  if (typeof code !== 'string' || code.trim() === '') {
    throw new InputError({ field: 'code', message: 'is empty or not a string', fix: 'give a laminate code such as [0/±45/90]s' });
  }
  const p = new CodeParser(code);
  p.expect('[', "'[' to open the code");
  const items = p.sequence();
  p.expect(']', "'/' or ']'");
  if (p.peek() === '_') p.i++;
  const braced = p.peek() === '{';
  if (braced) p.i++;
  const repeat = /[0-9]/.test(p.peek()) || SUBSCRIPT_DIGITS.includes(p.peek() || '\0') ? p.count(true) : 1;
  let symmetric = false;
  if (/[sS]/.test(p.peek())) { symmetric = true; p.i++; }
  else if (/[tT]/.test(p.peek())) p.i++;
  if (braced) p.expect('}', "'}'");
  p.skipSpace();
  if (p.i < code.length) fail(code, p.i, `expected the end of the code after the suffix (a count, then 's' or 'T') but found ${p.found()}`);

  const marks = findMidMarks(items, []);
  const last = items[items.length - 1];
  for (const mark of marks) {
    const ok = symmetric && mark === last && mark.kind === 'ply' && mark.count === 1 && mark.angles.length === 1 && repeat === 1;
    if (!ok) fail(code, mark.at, 'a mid-plane mark (bar or *) belongs only on the last single ply of a symmetric code without a repeat count, such as [0/45/90*]s');
  }
  const mid = marks.length ? (last as Extract<Item, { kind: 'ply' }>).angles[0] : null;
  const body = mid === null ? items : items.slice(0, -1);
  const halfSize = expandedSize(body) * repeat;
  const total = symmetric ? 2 * halfSize + (mid === null ? 0 : 1) : halfSize;
  if (halfSize > MAX_PLIES || total > MAX_PLIES) {
    throw new InputError({ field: 'code', message: `"${code}" expands to more than ${MAX_PLIES} plies`, fix: 'use a shorter stack' });
  }
  const once = expand(body, []);
  const half: number[] = [];
  for (let r = 0; r < repeat; r++) half.push(...once);
  if (!symmetric) return half;
  return [...half, ...(mid === null ? [] : [mid]), ...half.slice().reverse()];
}
