/**
 * A small seeded pseudo-random generator for Monte Carlo checks: deterministic, so the
 * same seed gives the same numbers on every machine.
 *
 * @module uncertainty
 */
import { show, invalidArgument } from '../errors.js';

/** A stream of pseudo-random numbers from one seed. Each call advances the stream. */
export interface RandomStream {
  /** The next 32-bit output, an integer in [0, 2³²). */
  nextUint32(): number;
  /** A uniform deviate in the open interval (0, 1), with 53 random bits. */
  uniform(): number;
  /** A standard normal deviate N(0, 1). */
  normal(): number;
}

const MASK64 = (1n << 64n) - 1n;

/** SplitMix64 (Steele, Lea & Flood, "Fast splittable pseudorandom number generators", OOPSLA 2014). */
function splitmix64(state: bigint): { state: bigint; out: bigint } {
  const s = (state + 0x9e3779b97f4a7c15n) & MASK64;
  let z = s;
  z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
  z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
  return { state: s, out: z ^ (z >> 31n) };
}

/**
 * A seeded stream: xoshiro128** (Blackman & Vigna, "Scrambled linear pseudorandom number
 * generators", ACM Trans. Math. Softw. 47(4), 2021), its 128-bit state filled from the seed
 * by SplitMix64 as those authors advise; normal deviates by the Box–Muller transform (Box
 * & Muller, Ann. Math. Statist. 29, 1958; JCGM 101:2008 annex C.4).
 *
 * Not for cryptography. Period 2¹²⁸ − 1.
 *
 * @param seed an integer in [0, 2⁶⁴) (a safe-integer number or a bigint)
 * @returns the stream
 * @throws {QuadspreadError} `INVALID_ARGUMENT` when the seed is not such an integer.
 * @example
 * ```ts
 * import { randomStream } from 'quadspread';
 * const a = randomStream(42);
 * const b = randomStream(42);
 * [a.uniform() === b.uniform(), a.uniform() > 0 && a.uniform() < 1];
 * //=> [true, true]
 * ```
 */
export function randomStream(seed: number | bigint): RandomStream {
  const okNumber = typeof seed === 'number' && Number.isSafeInteger(seed) && seed >= 0;
  const okBig = typeof seed === 'bigint' && seed >= 0n && seed <= MASK64;
  if (!okNumber && !okBig) {
    throw invalidArgument('randomStream(seed)', `${show(seed)} is not an integer in [0, 2^64)`);
  }
  let st = BigInt(seed);
  const words: number[] = [];
  for (let i = 0; i < 2; i++) {
    const r = splitmix64(st);
    st = r.state;
    words.push(Number(r.out & 0xffffffffn), Number(r.out >> 32n));
  }
  let [s0, s1, s2, s3] = words as [number, number, number, number];
  if ((s0 | s1 | s2 | s3) === 0) s0 = 1; // the all-zero state is the one forbidden state
  const rotl = (x: number, k: number) => (x << k) | (x >>> (32 - k));
  const nextUint32 = (): number => {
    // xoshiro128**: result = rotl(s1 · 5, 7) · 9
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = rotl(s3, 11);
    return result;
  };
  const uniform = (): number => {
    // 53 bits: 27 from one output, 26 from the next; +0.5 keeps it off 0 and 1.
    const hi = nextUint32() >>> 5;
    const lo = nextUint32() >>> 6;
    return (hi * 67108864 + lo + 0.5) / 9007199254740992;
  };
  let spare: number | undefined;
  const normal = (): number => {
    if (spare !== undefined) {
      const z = spare;
      spare = undefined;
      return z;
    }
    // Box–Muller: √(−2 ln u₁)·(cos 2πu₂, sin 2πu₂) are two independent N(0, 1) deviates.
    const r = Math.sqrt(-2 * Math.log(uniform()));
    const t = 2 * Math.PI * uniform();
    spare = r * Math.sin(t);
    return r * Math.cos(t);
  };
  return { nextUint32, uniform, normal };
}
