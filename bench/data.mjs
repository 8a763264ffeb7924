// Deterministic test data for the benchmarks (a small xorshift generator, seeded).
export function rng(seed = 0x9e3779b9) {
  let s = seed >>> 0 || 1;
  return () => {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    return s / 4294967296;
  };
}

/** An integer number of millimetres as metres text with 3 decimals, e.g. 12345678 → '12345.678'. */
export function mm(m) {
  const neg = m < 0;
  const a = Math.abs(m);
  const s = `${Math.floor(a / 1000)}.${String(a % 1000).padStart(3, '0')}`;
  return neg ? `-${s}` : s;
}

/** A number with `digits` significant digits, as text (a random value in [1, 10)·10^k). */
export function sig(rand, digits, k) {
  let t = String(1 + Math.floor(rand() * 9));
  for (let i = 1; i < digits; i++) t += String(Math.floor(rand() * 10));
  // t is an integer of `digits` digits; scale it to magnitude 10^k.
  const e = k - (digits - 1);
  return e >= 0 ? t + '0'.repeat(e) : `${t}e${e}`;
}
