/**
 * Transcendental functions on decimal text, correctly rounded to a stated number of
 * significant digits. Used by `decimal(digits)` and (at
 * `RATIONAL_TRANSCENDENTAL_DIGITS`) by `rational`.
 *
 * Method (after J.-M. Muller, *Elementary Functions: Algorithms and Implementation*,
 * 3rd ed., Birkhäuser 2016, ch. 11 (argument reduction) and ch. 12 (final rounding), and
 * R. P. Brent & P. Zimmermann, *Modern Computer Arithmetic*, CUP 2010, ch. 4):
 *
 * - every argument is read exactly as a ratio of bigints;
 * - each function is evaluated in binary fixed point (a bigint F standing for F / 2^W)
 *   together with a rigorous bound E on its error, so the true value lies in
 *   [(F − E)/2^W, (F + E)/2^W];
 * - argument reduction (x − k·π/2, x − k·ln 2) uses π or ln 2 with as many extra bits as
 *   k has, so huge arguments lose nothing;
 * - Ziv's strategy (A. Ziv, "Fast evaluation of elementary mathematical functions with
 *   correctly rounded last bit", ACM TOMS 17(3), 1991; Muller ch. 12): when both ends of
 *   the interval round to the same `digits`-digit decimal, that decimal is the correctly
 *   rounded result; otherwise the working precision is doubled and the evaluation repeated.
 *
 * Results are rounded to nearest. Exact cases (sin 0, tan 0, atan2(0, x > 0), exp 0,
 * ln 1) are returned exactly; every other result of these functions at a rational
 * argument is irrational (Lindemann–Weierstrass), so it is never a rounding tie.
 * `sqrt` is computed exactly with integer square roots and rounded half to even.
 *
 * @module arithmetic
 */
import {
  QuadspreadError,
  show,
  invalidNumber,
  inputTooLong,
  invalidArgument,
  noRealSolution,
  zeroVectorAngle,
  textTooLong,
} from '../errors.js';
import { bitLength, DECIMAL, isqrt, pow10 } from './exact.js';

/** Transcendental functions working on decimal text, to a fixed number of significant digits. */
export interface DecimalElementary {
  /** Significant digits of every result. */
  readonly digits: number;
  /** π, correctly rounded. */
  readonly pi: string;
  /** sin x, x in radians, correctly rounded. */
  sin(x: string): string;
  /** cos x, x in radians, correctly rounded. */
  cos(x: string): string;
  /** atan2(y, x) in (−π, π], correctly rounded; the caller refuses x = y = 0. */
  atan2(y: string, x: string): string;
  /**
   * tan x, x in radians, correctly rounded.
   * @throws {QuadspreadError} `INVALID_ARGUMENT` for |x| ≥ 10^1001.
   */
  tan(x: string): string;
  /** atan x in (−π/2, π/2), correctly rounded. */
  atan(x: string): string;
  /**
   * √x, correctly rounded (ties to even).
   * @throws {QuadspreadError} `NO_REAL_SOLUTION` when x < 0.
   */
  sqrt(x: string): string;
  /**
   * e^x, correctly rounded.
   * @throws {QuadspreadError} `INVALID_ARGUMENT` when |x| > 2302585 (the result's decimal
   * exponent would pass ±10^6).
   */
  exp(x: string): string;
  /**
   * ln x (natural logarithm), correctly rounded.
   * @throws {QuadspreadError} `NO_REAL_SOLUTION` when x ≤ 0.
   */
  ln(x: string): string;
  /**
   * sin, cos and atan2 of exact ratios n/d (d > 0), reduced by π/2 exactly whatever their
   * length: for the exact arithmetic, whose values would lose digits as decimal text.
   * @internal
   */
  ratio?: {
    sin(n: bigint, d: bigint): string;
    cos(n: bigint, d: bigint): string;
    atan2(yn: bigint, yd: bigint, xn: bigint, xd: bigint): string;
  };
}

/** Longest text accepted as an argument (a 1000-digit value with sign, point and exponent fits). */
const MAX_TEXT = 4000;
/** Largest |decimal exponent| of an argument. */
const MAX_ARG_EXPONENT = 20000;
/** Largest decimal exponent of an argument to sin, cos, tan (reduction needs that many digits of π). */
const MAX_REDUCED_EXPONENT = 1001;
const LOG2_10 = 3.321928094887362;

const abs = (a: bigint): bigint => (a < 0n ? -a : a);
/** a · b / 2^B truncated toward zero (so that series terms of either sign reach 0). */
const mulShift = (a: bigint, b: bigint, B: bigint): bigint => {
  const p = a * b;
  return p < 0n ? -(-p >> B) : p >> B;
};
const blen = (a: bigint): number => (a === 0n ? 0 : bitLength(abs(a)));

/** An exact decimal argument: coef · 10^exp, and the same as a ratio n/d (d > 0). */
interface Arg {
  readonly coef: bigint;
  readonly exp: number;
  readonly n: bigint;
  readonly d: bigint;
}

function readArg(text: string, where: string): Arg {
  if (typeof text !== 'string') throw invalidNumber(where, `${show(text)} is not decimal text`);
  if (text.length > MAX_TEXT) throw textTooLong(where, text.length, MAX_TEXT);
  const m = DECIMAL.exec(text.trim());
  if (!m || (m[2] === undefined && (m[3] === undefined || m[3] === ''))) {
    throw invalidNumber(where, `${show(text)} is not decimal text`);
  }
  const frac = m[3] ?? '';
  let coef = BigInt((m[2] ?? '') + frac || '0');
  if (m[1] === '-') coef = -coef;
  const e = m[4] === undefined ? 0 : Number(m[4]);
  const exp = e - frac.length;
  if (
    !Number.isSafeInteger(e) ||
    (coef !== 0n && Math.abs(exp + String(abs(coef)).length) > MAX_ARG_EXPONENT)
  ) {
    throw inputTooLong(where, `${show(text)} has a decimal exponent beyond ±${MAX_ARG_EXPONENT}`);
  }
  if (coef === 0n) return { coef: 0n, exp: 0, n: 0n, d: 1n };
  return exp >= 0
    ? { coef, exp, n: coef * pow10(exp), d: 1n }
    : { coef, exp, n: coef, d: pow10(-exp) };
}

/** An exact argument n/d (d > 0) in the form {@link readArg} gives: `coef`·10^`exp` has its magnitude. */
function argOfRatio(n: bigint, d: bigint, where: string): Arg {
  if (n === 0n) return { coef: 0n, exp: 0, n: 0n, d: 1n };
  const magnitude = String(abs(n)).length - String(d).length;
  if (Math.abs(magnitude) > MAX_ARG_EXPONENT)
    throw inputTooLong(where, `the argument has a decimal exponent beyond ±${MAX_ARG_EXPONENT}`);
  return { coef: n < 0n ? -1n : 1n, exp: magnitude, n, d };
}

/** round(n · 2^W / d) for d > 0, W ≥ 0: error ≤ 1/2. */
function toFixed(n: bigint, d: bigint, W: number): bigint {
  const num = n << BigInt(W);
  const q = num / d;
  const r = num - q * d; // sign of num
  if (2n * abs(r) >= d) return q + (num < 0n ? -1n : 1n);
  return q;
}

/** a / b rounded to nearest (b ≠ 0). */
function roundDiv(a: bigint, b: bigint): bigint {
  if (b < 0n) {
    a = -a;
    b = -b;
  }
  const q = a / b;
  const r = a - q * b;
  if (2n * abs(r) >= b) return q + (a < 0n ? -1n : 1n);
  return q;
}

/** A fixed-point enclosure: the true value lies in [(F − E)/2^W, (F + E)/2^W]. */
interface Approx {
  readonly F: bigint;
  readonly E: bigint;
  readonly W: number;
}

/** A decimal coef · 10^exp with |coef| of exactly `digits` digits (or 0). */
interface Rounded {
  readonly coef: bigint;
  readonly exp: number;
}

/** n / 2^W (n > 0) rounded to nearest with `digits` significant digits. */
function roundPositive(n: bigint, W: number, digits: number): Rounded {
  // Decimal exponent e with 10^e ≤ v < 10^(e+1), estimated from the bit length then fixed.
  let e = Math.floor((bitLength(n) - 1 - W) / LOG2_10);
  const scaled = (k: number): { num: bigint; den: bigint } => {
    // v · 10^k as num/den
    let num = n;
    let den = 1n;
    if (W >= 0) den <<= BigInt(W);
    else num <<= BigInt(-W);
    if (k >= 0) num *= pow10(k);
    else den *= pow10(-k);
    return { num, den };
  };
  for (;;) {
    const lo = scaled(-e); // v / 10^e, must be in [1, 10)
    if (lo.num < lo.den) e -= 1;
    else if (lo.num >= 10n * lo.den) e += 1;
    else break;
  }
  const k = digits - 1 - e;
  const { num, den } = scaled(k);
  let q = num / den;
  if (2n * (num - q * den) >= den) q += 1n;
  let exp = -k;
  if (q === pow10(digits)) {
    q = pow10(digits - 1);
    exp += 1;
  }
  return { coef: q, exp };
}

/** The correctly rounded value when the enclosure decides it, else undefined. */
function decide(a: Approx, digits: number): Rounded | undefined {
  const lo = a.F - a.E;
  const hi = a.F + a.E;
  if (lo <= 0n && hi >= 0n) return undefined;
  const neg = hi < 0n;
  const r1 = roundPositive(neg ? -lo : lo, a.W, digits);
  const r2 = roundPositive(neg ? -hi : hi, a.W, digits);
  if (r1.coef !== r2.coef || r1.exp !== r2.exp) return undefined;
  return neg ? { coef: -r1.coef, exp: r1.exp } : r1;
}

/** Decimal text of coef · 10^exp: trailing zeros dropped; plain unless the exponent is outside [−7, 21). */
function format(r: Rounded): string {
  const { coef } = r;
  let { exp } = r;
  if (coef === 0n) return '0';
  const neg = coef < 0n;
  let s = String(abs(coef));
  let z = s.length;
  while (z > 1 && s[z - 1] === '0') z -= 1;
  exp += s.length - z;
  s = s.slice(0, z);
  const sci = exp + s.length - 1; // exponent of the leading digit
  let out: string;
  if (sci >= 21 || sci < -7) {
    out =
      s.length > 1
        ? `${s[0]}.${s.slice(1)}e${sci >= 0 ? '+' : ''}${sci}`
        : `${s}e${sci >= 0 ? '+' : ''}${sci}`;
  } else if (exp >= 0) {
    out = s + '0'.repeat(exp);
  } else if (sci >= 0) {
    out = `${s.slice(0, s.length + exp)}.${s.slice(s.length + exp)}`;
  } else {
    out = `0.${'0'.repeat(-sci - 1)}${s}`;
  }
  return neg ? `-${out}` : out;
}

/** Integer part of log2 |n/d| within ±1 (n ≠ 0). */
function log2Estimate(n: bigint, d: bigint): number {
  return blen(n) - blen(d);
}

// ---------------------------------------------------------------------------
// Fixed-point kernels. All take and return bigints scaled by 2^W.

/** atan(1/m) · 2^W by its Taylor series; error ≤ 2 per term (Brent & Zimmermann ch. 4). */
function atanInverse(m: bigint, W: number): { sum: bigint; terms: number } {
  const m2 = m * m;
  let t = (1n << BigInt(W)) / m; // 1/m^(2k+1)
  let sum = 0n;
  let k = 0n;
  let terms = 0;
  while (t !== 0n) {
    const term = t / (2n * k + 1n);
    sum = k % 2n === 0n ? sum + term : sum - term;
    t /= m2;
    k += 1n;
    terms += 1;
  }
  return { sum, terms };
}

/**
 * π · 2^W with error ≤ 2, by Machin's formula π = 16 atan(1/5) − 4 atan(1/239)
 * (J. Machin, 1706; see Brent & Zimmermann ch. 4).
 */
function machinPi(W: number): bigint {
  const G = 2 * Math.ceil(Math.log2(W + 16)) + 8; // guard bits for the ≈ 2W/3 truncations
  const a = atanInverse(5n, W + G);
  const b = atanInverse(239n, W + G);
  const p = 16n * a.sum - 4n * b.sum;
  return p >> BigInt(G);
}

/** ln 2 · 2^W with error ≤ 2, by ln 2 = 2 atanh(1/3) = Σ 2 / ((2k+1) 3^(2k+1)) (Brent & Zimmermann ch. 4). */
function ln2Fixed(W: number): bigint {
  const G = 2 * Math.ceil(Math.log2(W + 16)) + 8;
  const Wg = W + G;
  let t = (2n << BigInt(Wg)) / 3n;
  let sum = 0n;
  let k = 0n;
  while (t !== 0n) {
    sum += t / (2n * k + 1n);
    t /= 9n;
    k += 1n;
  }
  return sum >> BigInt(G);
}

/** sin r or cos r · 2^W for |r| ≤ 1 by Taylor series; returns value and number of terms. */
function sinCosSeries(r: bigint, W: number, cosine: boolean): { v: bigint; terms: number } {
  const B = BigInt(W);
  const r2 = (r * r) >> B;
  let term = cosine ? 1n << B : r;
  let sum = term;
  let k = cosine ? 1n : 2n; // next denominator factors k, k+1
  let terms = 1;
  while (term !== 0n) {
    term = -mulShift(term, r2, B) / (k * (k + 1n));
    sum += term;
    k += 2n;
    terms += 1;
  }
  return { v: sum, terms };
}

/** atanh z · 2^W for |z| ≤ 1/2 by Σ z^(2k+1)/(2k+1). */
function atanhSeries(z: bigint, W: number): { v: bigint; terms: number } {
  const B = BigInt(W);
  const z2 = (z * z) >> B;
  let p = z;
  let sum = z;
  let k = 1n;
  let terms = 1;
  while (p !== 0n) {
    p = mulShift(p, z2, B);
    sum += p / (2n * k + 1n);
    k += 1n;
    terms += 1;
  }
  return { v: sum, terms };
}

/** atan t · 2^W for 0 ≤ t ≤ 1 by argument halving t ← t/(1 + √(1 + t²)), then the Taylor series (Muller ch. 11; Brent & Zimmermann ch. 4). */
function atanFixed(T: bigint, W: number): { v: bigint; err: bigint } {
  const B = BigInt(W);
  const one = 1n << B;
  const halvings = Math.max(2, Math.round(Math.sqrt(W) / 3));
  let t = T;
  for (let i = 0; i < halvings; i++) {
    // atan t = 2 atan(t / (1 + √(1 + t²)))  (half-angle identity)
    const s = isqrt((one + ((t * t) >> B)) << B);
    t = (t << B) / (one + s);
  }
  const B2 = (t * t) >> B;
  let p = t;
  let sum = t;
  let k = 1n;
  let terms = 1;
  while (p !== 0n) {
    p = -mulShift(p, B2, B);
    sum += p / (2n * k + 1n);
    k += 1n;
    terms += 1;
  }
  // Halving steps contract the error (derivative ≤ 1/2) and add ≤ 2 each: ≤ 4 on entry
  // to the series; the series adds ≤ 2 per term; the doubling multiplies by 2^halvings.
  const err = BigInt(2 * terms + 8) << BigInt(halvings);
  return { v: sum << BigInt(halvings), err };
}

/**
 * The transcendental functions to `digits` significant digits, correctly rounded (see
 * the module notes). π and ln 2 are kept, once computed, in this object's closure at the
 * highest precision met so far.
 *
 * @param digits significant digits, an integer in 1..1000
 * @returns the functions, each taking and returning decimal text
 * @throws {QuadspreadError} `INVALID_ARGUMENT` when `digits` is not such an integer.
 * @example
 * ```ts
 * import { decimalElementary } from 'quadspread';
 * const E = decimalElementary(30);
 * E.pi;
 * //=> '3.14159265358979323846264338328'
 * E.sin('1');
 * //=> '0.84147098480789650665250232163'
 * ```
 */
export function decimalElementary(digits: number): DecimalElementary {
  if (!Number.isInteger(digits) || digits < 1 || digits > 1000) {
    throw invalidArgument(
      'decimalElementary(digits)',
      `digits ${show(digits)} is not an integer in 1..1000`,
    );
  }
  const name = `decimalElementary(${digits})`;
  const baseBits = Math.ceil(digits * LOG2_10) + 24;

  // Closure memos of π and ln 2: the most precise value computed so far (error ≤ 2 there,
  // ≤ 3 once shifted down to fewer bits).
  let piBits = 0;
  let piVal = 0n;
  const pi = (W: number): bigint => {
    if (W > piBits) {
      piBits = W + 64;
      piVal = machinPi(piBits);
    }
    return piVal >> BigInt(piBits - W);
  };
  let ln2Bits = 0;
  let ln2Val = 0n;
  const ln2 = (W: number): bigint => {
    if (W > ln2Bits) {
      ln2Bits = W + 64;
      ln2Val = ln2Fixed(ln2Bits);
    }
    return ln2Val >> BigInt(ln2Bits - W);
  };

  /** Ziv's loop: evaluate at W0 bits, doubling until the enclosure decides the rounding. */
  const ziv = (where: string, W0: number, approx: (W: number) => Approx): string => {
    let W = W0;
    const limit = 8 * W0 + 40000;
    for (;;) {
      const r = decide(approx(W), digits);
      if (r) return format(r);
      if (W > limit)
        throw new QuadspreadError(
          'NOT_CONVERGED',
          where,
          `the rounding to ${digits} digits was not decided at ${W} bits`,
        );
      W *= 2;
    }
  };

  /**
   * x reduced by the nearest multiple q of π/2: r · 2^Wr with |r| ≤ π/4 (a little more),
   * error ≤ 2, and q mod 4 (Muller ch. 11: reduction with π to as many extra bits as q has).
   */
  const reduce = (x: Arg, Wr: number, where: string): { r: bigint; quadrant: number } => {
    if (x.exp + String(abs(x.coef)).length > MAX_REDUCED_EXPONENT) {
      throw invalidArgument(
        where,
        `|x| ≥ 10^${MAX_REDUCED_EXPONENT} is too large to reduce by π/2`,
      );
    }
    // |x| < 3/4 < π/4: no reduction.
    if (4n * abs(x.n) < 3n * x.d) return { r: toFixed(x.n, x.d, Wr), quadrant: 0 };
    const L = Math.max(0, log2Estimate(x.n, x.d) + 2); // |x| < 2^(L−1)
    const Wp = Wr + L + 5;
    // At Wp bits: X = x (error ≤ 1/2); P = π · 2^(Wp−1) = π/2 · 2^Wp (error ≤ 3).
    const X = toFixed(x.n, x.d, Wp);
    const P = pi(Wp - 1);
    const q = roundDiv(X, P); // |q| < 2^(L−1)
    // R = X − q·P: error ≤ 1/2 + 3|q| < 2^(L+1); shifted down by L + 5 bits: < 1.1.
    const r = (X - q * P) >> BigInt(Wp - Wr);
    return { r, quadrant: Number(((q % 4n) + 4n) % 4n) };
  };

  /** sin x (which = 0) or cos x (which = 1) at W bits. */
  const sinCos = (x: Arg, W: number, which: 0 | 1, where: string): Approx => {
    const { r, quadrant } = reduce(x, W, where);
    // sin(r + qπ/2), cos(r + qπ/2) from sin r, cos r.
    const k = (quadrant + which) % 4; // 0: sin r, 1: cos r, 2: −sin r, 3: −cos r
    const s = sinCosSeries(r, W, k % 2 === 1);
    const F = k >= 2 ? -s.v : s.v;
    // r's error (< 2) passes with factor ≤ 1; each term adds ≤ 3.
    return { F, E: BigInt(3 * s.terms + 8), W };
  };

  const extraForSmall = (x: Arg): number => Math.max(0, -log2Estimate(x.n, x.d) + 1);

  const sinOf = (x: Arg, where: string): string =>
    x.n === 0n ? '0' : ziv(where, baseBits + extraForSmall(x), (W) => sinCos(x, W, 0, where));
  const sin = (text: string): string => sinOf(readArg(text, `${name}.sin(x)`), `${name}.sin(x)`);

  const cosOf = (x: Arg, where: string): string =>
    x.n === 0n ? '1' : ziv(where, baseBits, (W) => sinCos(x, W, 1, where));
  const cos = (text: string): string => cosOf(readArg(text, `${name}.cos(x)`), `${name}.cos(x)`);

  const tan = (text: string): string => {
    const where = `${name}.tan(x)`;
    const x = readArg(text, where);
    if (x.n === 0n) return '0';
    return ziv(where, baseBits + extraForSmall(x), (W) => {
      const S = sinCos(x, W, 0, where);
      const C = sinCos(x, W, 1, where);
      const e = S.E > C.E ? S.E : C.E;
      const c = abs(C.F);
      if (c <= 2n * e) return { F: 0n, E: 1n, W }; // undecided: cos too close to 0
      // |S/C − S'/C'| ≤ e (|S| + |C|) / (|C| (|C| − e)), in units of 2^−W.
      const F = roundDiv(S.F << BigInt(W), C.F);
      const E = ((e * (abs(S.F) + c)) << BigInt(W)) / (c * (c - e)) + 2n;
      return { F, E, W };
    });
  };

  const atan2 = (yText: string, xText: string): string => {
    const where = `${name}.atan2(y, x)`;
    return atan2Of(readArg(yText, where), readArg(xText, where), where);
  };

  const atan2Of = (y: Arg, x: Arg, where: string): string => {
    if (y.n === 0n && x.n === 0n) throw zeroVectorAngle(where);
    if (y.n === 0n && x.n > 0n) return '0';
    // t = min(|y|, |x|) / max(|y|, |x|), exactly.
    const ay = abs(y.n) * x.d;
    const ax = abs(x.n) * y.d;
    const swap = ay > ax;
    const tn = swap ? ax : ay;
    const td = swap ? ay : ax;
    // Extra bits when the angle is tiny (|y| ≪ x).
    const extra = !swap && x.n > 0n && tn !== 0n ? Math.max(0, log2Estimate(td, tn) + 1) : 0;
    return ziv(where, baseBits + extra, (W) => {
      const Wa = W + 4;
      const T = tn === 0n ? 0n : toFixed(tn, td, Wa);
      let { v, err } = T === 0n ? { v: 0n, err: 0n } : atanFixed(T, Wa);
      err += 1n; // T's rounding (≤ 1/2, derivative ≤ 1)
      const P = pi(Wa); // error ≤ 3
      if (swap) {
        v = (P >> 1n) - v; // π/2 − a
        err += 3n;
      }
      if (x.n < 0n) {
        v = P - v; // π − a
        err += 3n;
      }
      if (y.n < 0n) v = -v;
      return { F: v, E: err, W: Wa };
    });
  };

  const atan = (text: string): string => {
    return atan2(text, '1');
  };

  const sqrt = (text: string): string => {
    const where = `${name}.sqrt(x)`;
    const x = readArg(text, where);
    if (x.coef === 0n) return '0';
    if (x.coef < 0n) throw noRealSolution(where, `x = ${show(text)} is negative`);
    let { coef, exp } = x;
    // Make exp even and coef long enough for digits + 2 digits of root.
    let shift = Math.max(0, 2 * (digits + 2) - String(coef).length);
    if ((exp - shift) % 2 !== 0) shift += 1;
    coef *= pow10(shift);
    exp -= shift;
    const r = isqrt(coef);
    const inexact = r * r !== coef;
    // Round r (≥ digits + 2 digits) to `digits` digits, half to even, honouring the sticky bit.
    const drop = String(r).length - digits;
    const unit = pow10(drop);
    let q = r / unit;
    const rem = r - q * unit;
    const half = unit / 2n;
    if (rem > half || (rem === half && (inexact || q % 2n === 1n))) q += 1n;
    return format({ coef: q, exp: exp / 2 + drop });
  };

  const exp = (text: string): string => {
    const where = `${name}.exp(x)`;
    const x = readArg(text, where);
    if (x.n === 0n) return '1';
    if (abs(x.n) > 2302585n * x.d)
      throw invalidArgument(where, `|x| = ${show(text)} > 2302585: e^x is beyond 10^±1000000`);
    return ziv(where, baseBits, (W) => {
      // x = k ln 2 + r, |r| ≤ ln 2 / 2; e^x = 2^k e^r (Muller ch. 11).
      const L = Math.max(0, log2Estimate(x.n, x.d) + 2);
      const Wp = W + L + 4;
      const X = toFixed(x.n, x.d, Wp);
      const l2 = ln2(Wp); // error ≤ 3
      const k = roundDiv(X, l2);
      const r = (X - k * l2) >> BigInt(L + 4); // error ≤ (1/2 + 3|k|)/2^(L+4) + 1 < 2
      // e^r by Taylor series; |r| < 0.35 so the error of r grows by at most e^0.35 < 1.5.
      const B = BigInt(W);
      let term = 1n << B;
      let sum = term;
      let j = 1n;
      let terms = 1;
      while (term !== 0n) {
        term = mulShift(term, r, B) / j;
        sum += term;
        j += 1n;
        terms += 1;
      }
      return { F: sum, E: BigInt(2 * terms + 8), W: W - Number(k) };
    });
  };

  const ln = (text: string): string => {
    const where = `${name}.ln(x)`;
    const x = readArg(text, where);
    if (x.n <= 0n) throw noRealSolution(where, `x = ${show(text)} is not positive`);
    if (x.n === x.d) return '0';
    // x = 2^k m with m in [2/3, 4/3); ln x = k ln 2 + 2 atanh((m − 1)/(m + 1)) (Brent & Zimmermann ch. 4).
    let k = log2Estimate(x.n, x.d);
    let mn = k >= 0 ? x.n : x.n << BigInt(-k);
    let md = k >= 0 ? x.d << BigInt(k) : x.d;
    while (3n * mn >= 4n * md) {
      md <<= 1n;
      k += 1;
    }
    while (3n * mn < 2n * md) {
      mn <<= 1n;
      k -= 1;
    }
    const zn = mn - md; // z = (m − 1)/(m + 1), |z| ≤ 1/5
    const zd = mn + md;
    // Extra bits when x is near 1 (ln x tiny).
    const extra = k === 0 && zn !== 0n ? Math.max(0, log2Estimate(zd, zn) + 1) : 0;
    return ziv(where, baseBits + extra, (W) => {
      const Z = toFixed(zn, zd, W);
      const a = atanhSeries(Z, W); // error ≤ 1/2·(25/24) + 2 per term
      let F = 2n * a.v;
      let E = BigInt(4 * a.terms + 6);
      if (k !== 0) {
        const Wk = W + blen(BigInt(k)) + 2;
        F += (BigInt(k) * ln2(Wk)) >> BigInt(Wk - W);
        E += 2n;
      }
      return { F, E, W };
    });
  };

  let piText: string | undefined;
  return Object.freeze({
    digits,
    get pi(): string {
      if (piText === undefined)
        piText = ziv(`${name}.pi`, baseBits, (W) => ({ F: pi(W), E: 3n, W }));
      return piText;
    },
    sin,
    cos,
    tan,
    atan2,
    atan,
    sqrt,
    exp,
    ln,
    ratio: {
      sin: (n: bigint, d: bigint) => sinOf(argOfRatio(n, d, `${name}.sin(x)`), `${name}.sin(x)`),
      cos: (n: bigint, d: bigint) => cosOf(argOfRatio(n, d, `${name}.cos(x)`), `${name}.cos(x)`),
      atan2: (yn: bigint, yd: bigint, xn: bigint, xd: bigint) =>
        atan2Of(
          argOfRatio(yn, yd, `${name}.atan2(y, x)`),
          argOfRatio(xn, xd, `${name}.atan2(y, x)`),
          `${name}.atan2(y, x)`,
        ),
    },
  });
}
