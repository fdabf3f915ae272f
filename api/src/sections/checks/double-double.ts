/**
 * Double-double arithmetic: a number held as an unevaluated sum hi + lo of two
 * doubles, about 32 significant digits, from the error-free transformations
 * TwoSum (Knuth, The Art of Computer Programming vol. 2) and TwoProduct with
 * Dekker's splitting (Dekker 1971, "A floating-point technique for extending
 * the available precision", Numer. Math. 18). The checks need it because the
 * stiffness matrix of a beam of n elements has a condition number growing
 * like n⁴: in plain doubles a 1000-element strip would lose half its digits.
 */

export interface DoubleDouble {
  hi: number;
  lo: number;
}

const SPLITTER = 134217729; // 2^27 + 1

function twoSum(a: number, b: number): DoubleDouble {
  const s = a + b;
  const bb = s - a;
  return { hi: s, lo: a - (s - bb) + (b - bb) };
}

function quickTwoSum(a: number, b: number): DoubleDouble {
  const s = a + b;
  return { hi: s, lo: b - (s - a) };
}

function twoProduct(a: number, b: number): DoubleDouble {
  const p = a * b;
  const ca = SPLITTER * a;
  const aHi = ca - (ca - a);
  const aLo = a - aHi;
  const cb = SPLITTER * b;
  const bHi = cb - (cb - b);
  const bLo = b - bHi;
  return { hi: p, lo: aHi * bHi - p + aHi * bLo + aLo * bHi + aLo * bLo };
}

export function dd(value: number): DoubleDouble {
  return { hi: value, lo: 0 };
}

export function ddAdd(x: DoubleDouble, y: DoubleDouble): DoubleDouble {
  const s = twoSum(x.hi, y.hi);
  const t = twoSum(x.lo, y.lo);
  const u = quickTwoSum(s.hi, s.lo + t.hi);
  return quickTwoSum(u.hi, u.lo + t.lo);
}

export function ddNegate(x: DoubleDouble): DoubleDouble {
  return { hi: -x.hi, lo: -x.lo };
}

export function ddSub(x: DoubleDouble, y: DoubleDouble): DoubleDouble {
  return ddAdd(x, ddNegate(y));
}

export function ddMul(x: DoubleDouble, y: DoubleDouble): DoubleDouble {
  const p = twoProduct(x.hi, y.hi);
  return quickTwoSum(p.hi, p.lo + (x.hi * y.lo + x.lo * y.hi));
}

/** x / y by two correction steps of the double quotient. */
export function ddDiv(x: DoubleDouble, y: DoubleDouble): DoubleDouble {
  const q1 = x.hi / y.hi;
  let r = ddSub(x, ddMul(dd(q1), y));
  const q2 = r.hi / y.hi;
  r = ddSub(r, ddMul(dd(q2), y));
  const q3 = r.hi / y.hi;
  return ddAdd(quickTwoSum(q1, q2), dd(q3));
}
