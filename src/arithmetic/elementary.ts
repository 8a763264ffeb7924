/**
 * Transcendental functions on decimal text, rounded to a stated number of significant
 * digits. Used by `decimal(digits)` and (at a fixed precision) by `rational`.
 *
 * STUB: goes through JS numbers (about 16 digits) until the correctly rounded
 * implementation lands. Do not rely on more than 15 digits.
 *
 * @module arithmetic
 */

/** Transcendental functions working on decimal text, to a fixed number of significant digits. */
export interface DecimalElementary {
  /** Significant digits of every result. */
  readonly digits: number;
  /** π */
  readonly pi: string;
  /** sin x, x in radians */
  sin(x: string): string;
  /** cos x, x in radians */
  cos(x: string): string;
  /** atan2(y, x) in (−π, π]; the caller refuses x = y = 0. */
  atan2(y: string, x: string): string;
}

/**
 * The transcendental functions to `digits` significant digits.
 * @param digits significant digits, 1..1000
 */
export function decimalElementary(digits: number): DecimalElementary {
  const p = Math.min(digits, 17);
  const out = (v: number) => v.toPrecision(p);
  return {
    digits,
    pi: out(Math.PI),
    sin: (x) => out(Math.sin(Number(x))),
    cos: (x) => out(Math.cos(Number(x))),
    atan2: (y, x) => out(Math.atan2(Number(y), Number(x))),
  };
}
