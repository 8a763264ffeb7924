/**
 * Approximate coordinates for the unknown points of a plane network, from the observations:
 * vectors, a bearing (from a bearing, an oriented direction round, or an angle on a known
 * line) with a distance, or two bearings from different stations (intersection). JS numbers:
 * the values only start the Gauss–Newton iteration.
 *
 * @module adjustment
 * @internal
 */
import { QuadspreadError } from '../errors.js';

/** An observation as the approximation reads it (JS numbers, degrees). @internal */
export type RoughObservation =
  | { kind: 'distance'; from: number; to: number; value: number }
  | { kind: 'bearing'; from: number; to: number; value: number }
  | { kind: 'angle'; at: number; from: number; to: number; value: number }
  | { kind: 'direction'; at: number; to: number; value: number; set: number }
  | { kind: 'vector'; from: number; to: number; dx: number; dy: number };

const RAD = Math.PI / 180;
const azimuth = (x0: number, y0: number, x1: number, y1: number): number => {
  const a = Math.atan2(x1 - x0, y1 - y0) / RAD;
  return a < 0 ? a + 360 : a;
};

/**
 * Fills `xy` (NaN for unknown) in place from the observations; throws `NO_APPROXIMATION`
 * naming the first point it cannot place. @internal
 */
export function approximateCoordinates(
  names: readonly string[],
  xy: [number, number][],
  obs: readonly RoughObservation[],
  where: string,
): void {
  const known = (i: number): boolean => !Number.isNaN(xy[i]![0]);
  const n = names.length;
  for (let round = 0; round <= n; round++) {
    let progress = false;
    // Orientation of each direction round: from a direction to a known point at a known station.
    const orient = new Map<number, number>();
    for (const o of obs)
      if (o.kind === 'direction' && !orient.has(o.set) && known(o.at) && known(o.to))
        orient.set(o.set, azimuth(...xy[o.at]!, ...xy[o.to]!) - o.value);
    // Bearings from a known station to each point, and distances.
    const rays: { at: number; to: number; az: number }[] = [];
    const dist = new Map<string, number>();
    for (const o of obs) {
      if (o.kind === 'vector') {
        if (known(o.from) && !known(o.to)) {
          xy[o.to] = [xy[o.from]![0] + o.dx, xy[o.from]![1] + o.dy];
          progress = true;
        } else if (known(o.to) && !known(o.from)) {
          xy[o.from] = [xy[o.to]![0] - o.dx, xy[o.to]![1] - o.dy];
          progress = true;
        }
      } else if (o.kind === 'distance') {
        dist.set(`${o.from},${o.to}`, o.value);
        dist.set(`${o.to},${o.from}`, o.value);
      } else if (o.kind === 'bearing') {
        rays.push({ at: o.from, to: o.to, az: o.value });
        rays.push({ at: o.to, to: o.from, az: o.value + 180 });
      } else if (o.kind === 'direction') {
        const w = orient.get(o.set);
        if (w !== undefined) rays.push({ at: o.at, to: o.to, az: o.value + w });
      } else if (known(o.at)) {
        if (known(o.from))
          rays.push({ at: o.at, to: o.to, az: azimuth(...xy[o.at]!, ...xy[o.from]!) + o.value });
        if (known(o.to))
          rays.push({ at: o.at, to: o.from, az: azimuth(...xy[o.at]!, ...xy[o.to]!) - o.value });
      }
    }
    const fromKnown = rays.filter((r) => known(r.at));
    for (const r of fromKnown) {
      if (known(r.to)) continue;
      const d = dist.get(`${r.at},${r.to}`);
      if (d !== undefined) {
        const [x, y] = xy[r.at]!;
        xy[r.to] = [x + d * Math.sin(r.az * RAD), y + d * Math.cos(r.az * RAD)];
        progress = true;
        continue;
      }
      // Intersection with another ray to the same point from another station.
      for (const s of fromKnown) {
        if (s.to !== r.to || s.at === r.at) continue;
        const [x1, y1] = xy[r.at]!;
        const [x2, y2] = xy[s.at]!;
        const u = [Math.sin(r.az * RAD), Math.cos(r.az * RAD)] as const;
        const v = [Math.sin(s.az * RAD), Math.cos(s.az * RAD)] as const;
        const det = u[0] * -v[1] + v[0] * u[1];
        if (Math.abs(det) < 1e-6) continue;
        const t = ((x2 - x1) * -v[1] + v[0] * (y2 - y1)) / det;
        xy[r.to] = [x1 + t * u[0], y1 + t * u[1]];
        progress = true;
        break;
      }
    }
    if (!progress) break;
  }
  for (let i = 0; i < n; i++)
    if (!known(i))
      throw new QuadspreadError(
        'NO_APPROXIMATION',
        where,
        `no approximate coordinates for ${JSON.stringify(names[i])} can be found from the observations (give its x and y)`,
      );
}
