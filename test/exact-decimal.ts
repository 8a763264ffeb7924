// A helper of the tests (not a test file): the exact decimal text of a double.

/**
 * The exact decimal text of a double (its significand times a power of two, expanded with
 * BigInt: m/2^k = m·5^k/10^k), so that a reference computed in many digits solves the problem
 * the double states. Reading a double through its shortest round-trip text instead can move it
 * by up to half a unit in its last place: near ±180° that is 1e-14°, which a short north–south
 * geodesic turns into 1e-11° of azimuth.
 */
export function exactDecimal(x: number): string {
  if (x === 0) return '0';
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  const bits = view.getBigUint64(0);
  const sign = bits >> 63n ? '-' : '';
  const expBits = Number((bits >> 52n) & 0x7ffn);
  let m = bits & ((1n << 52n) - 1n);
  let e = expBits - 1075;
  if (expBits === 0) e = -1074;
  else m |= 1n << 52n;
  if (e >= 0) return `${sign}${(m << BigInt(e)).toString()}`;
  const k = -e;
  const digits = (m * 5n ** BigInt(k)).toString().padStart(k + 1, '0');
  const text = `${digits.slice(0, -k)}.${digits.slice(-k)}`.replace(/0+$/, '').replace(/\.$/, '');
  return `${sign}${text}`;
}
