/**
 * The search for the elements near a point: a tree of the elements' boxes, built once per
 * `boxes` array of an alignment and kept (a bounding-volume hierarchy over runs of consecutive
 * elements, common practice in computational geometry; e.g. Samet, *Foundations of
 * Multidimensional and Metric Data Structures*, 2006, §2.1.5.2 on hierarchies of bounding
 * boxes). Not exported from the package.
 *
 * The tree answers exactly what a scan of every box in index order answers: a node's box
 * holds its elements' boxes, and the squared distance from a point to a box can only fall
 * (with rounding too: every step of it is monotonic) when the box grows, so a node farther
 * than a limit has no element nearer than it.
 *
 * @module alignment
 * @internal
 */

/** The boxes of an alignment in a complete binary tree (node k has children 2k and 2k + 1). @internal */
export interface BoxTree {
  /** The number of elements. */
  readonly n: number;
  /** The number of leaves, a power of two ≥ n: element i is the leaf `size + i`. */
  readonly size: number;
  /** Four numbers per node (min east, min north, max east, max north); node 0 is unused. */
  readonly b: Float64Array;
  /** A stack for the nearest-box search (one node per level), and its nodes' distances. */
  readonly stack: Int32Array;
  readonly stackQ: Float64Array;
}

// Trees by the `boxes` array of an alignment made by horizontalAlignment (frozen when made, so
// it cannot change; its copies share it), and the last one asked for: a comparison instead of a
// hash lookup on every call.
const kept = new WeakSet<readonly number[]>();
const trees = new WeakMap<readonly number[], BoxTree>();
let lastBoxes: readonly number[] | undefined;
let lastTree: BoxTree | undefined;

/** Marks the boxes of an alignment just made (and frozen) as ones whose tree may be kept. @internal */
export function keepBoxTree(boxes: readonly number[]): void {
  kept.add(boxes);
}

/**
 * The tree of an alignment's boxes (four numbers per element, as in `HorizontalAlignment.boxes`):
 * for the boxes of an alignment made by horizontalAlignment built on first use and kept; for any
 * other built anew, since it may have been changed in place. @internal
 */
export function boxTree(boxes: readonly number[]): BoxTree {
  if (boxes === lastBoxes) return lastTree!;
  if (!kept.has(boxes)) return buildTree(boxes);
  let t = trees.get(boxes);
  if (t === undefined) {
    t = buildTree(boxes);
    trees.set(boxes, t);
  }
  lastBoxes = boxes;
  lastTree = t;
  return t;
}

function buildTree(boxes: readonly number[]): BoxTree {
  const n = boxes.length >> 2;
  let size = 1;
  let depth = 0;
  while (size < n) {
    size *= 2;
    depth++;
  }
  const b = new Float64Array(8 * size);
  for (let i = 0; i < size; i++) {
    const k = 4 * (size + i);
    if (i < n) for (let j = 0; j < 4; j++) b[k + j] = boxes[4 * i + j]!;
    else {
      // No element: a box nowhere (every point is infinitely far from it).
      b[k] = Infinity;
      b[k + 1] = Infinity;
      b[k + 2] = -Infinity;
      b[k + 3] = -Infinity;
    }
  }
  // A node's box holds its children's: their union when both are proper boxes (min ≤ max, no
  // NaN); the one child's when the other is empty (no element, or a box infinitely far from
  // every point); the whole plane otherwise, so that a node is never farther than an element
  // under it, whatever numbers the boxes hold.
  for (let k = size - 1; k >= 1; k--) {
    const l = 8 * k;
    const r = l + 4;
    const o = 4 * k;
    const lEmpty = empty(b, l);
    if (lEmpty || empty(b, r)) {
      const c = lEmpty ? r : l;
      for (let j = 0; j < 4; j++) b[o + j] = b[c + j]!;
    } else if (proper(b, l) && proper(b, r)) {
      b[o] = Math.min(b[l]!, b[r]!);
      b[o + 1] = Math.min(b[l + 1]!, b[r + 1]!);
      b[o + 2] = Math.max(b[l + 2]!, b[r + 2]!);
      b[o + 3] = Math.max(b[l + 3]!, b[r + 3]!);
    } else {
      b[o] = -Infinity;
      b[o + 1] = -Infinity;
      b[o + 2] = Infinity;
      b[o + 3] = Infinity;
    }
  }
  return { n, size, b, stack: new Int32Array(depth + 1), stackQ: new Float64Array(depth + 1) };
}

/** Whether the box at offset o is the empty box (+∞, +∞, −∞, −∞). */
function empty(b: Float64Array, o: number): boolean {
  return (
    b[o] === Infinity && b[o + 1] === Infinity && b[o + 2] === -Infinity && b[o + 3] === -Infinity
  );
}

/** Whether the box at offset o has min ≤ max on both axes (and so no NaN). */
function proper(b: Float64Array, o: number): boolean {
  return b[o]! <= b[o + 2]! && b[o + 1]! <= b[o + 3]!;
}

/**
 * Squared distance from (px, py) to the box of node k: 0 inside it. For an element's leaf, the
 * very operations of a scan over `boxes`, so the same number. @internal
 */
export function nodeQ(b: Float64Array, k: number, px: number, py: number): number {
  const o = 4 * k;
  const x0 = b[o]!;
  const x1 = b[o + 2]!;
  const y0 = b[o + 1]!;
  const y1 = b[o + 3]!;
  const dx = px < x0 ? x0 - px : px > x1 ? px - x1 : 0;
  const dy = py < y0 ? y0 - py : py > y1 ? py - y1 : 0;
  return dx * dx + dy * dy;
}

/**
 * The element whose box is nearest to (px, py), the lowest index among equally near ones (0
 * when none is nearer than infinity): what a scan in index order keeping the first strictly
 * nearer box finds. The nearer child is searched first. @internal
 */
export function nearestBox(t: BoxTree, px: number, py: number): number {
  const { b, size, stack, stackQ } = t;
  let first = 0;
  let firstQ = Infinity;
  let sp = 0;
  let k = 1;
  let q = nodeQ(b, 1, px, py);
  for (;;) {
    // Only an element strictly nearer, or as near with a lower index, can change the answer.
    if (!(q > firstQ || (q === firstQ && lowest(k, size) >= first))) {
      if (k >= size) {
        first = k - size; // a real element: a leaf past the last one is infinitely far
        firstQ = q;
      } else {
        // Down to the nearer child (the left one when they are as near), the other kept.
        const l = 2 * k;
        const ql = nodeQ(b, l, px, py);
        const qr = nodeQ(b, l + 1, px, py);
        const left = ql <= qr;
        stack[sp] = left ? l + 1 : l;
        stackQ[sp++] = left ? qr : ql;
        k = left ? l : l + 1;
        q = left ? ql : qr;
        continue;
      }
    }
    if (sp === 0) return first;
    k = stack[--sp]!;
    q = stackQ[sp]!;
  }
}

/** The lowest element index under node k. */
function lowest(k: number, size: number): number {
  while (k < size) k *= 2;
  return k - size;
}

/**
 * The lowest element index i ≥ `from` whose box is not farther than `limit` (squared
 * distance, not > limit), or −1: the next element that a scan in index order skipping every
 * box with `boxQ > limit` would visit. @internal
 */
export function nextBox(t: BoxTree, px: number, py: number, limit: number, from: number): number {
  const { b, size } = t;
  if (from >= t.n) return -1;
  let k = size + from;
  for (;;) {
    if (!(nodeQ(b, k, px, py) > limit)) {
      if (k >= size) return k - size < t.n ? k - size : -1;
      k = 2 * k; // into the left child
      continue;
    }
    // Past this subtree: up while it is a right child, then to the right sibling.
    while (k & 1) k >>= 1;
    if (k === 0) return -1;
    k++;
  }
}
