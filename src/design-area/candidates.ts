// Candidate design areas on the rebuilt network: for each family of parallel branch lines, each starting
// line, each direction across the lines and each window along them, the heads the shape rules select.

import { cross, dot, type Point } from '../geometry/point.js';
import type { BranchLine, Network } from '../network/types.js';
import type { Head } from '../read/plan.js';
import type { Coverage } from '../coverage/coverage.js';
import { areaShape, type AreaShape } from './shape.js';

export interface LineFamily {
  /** Unit vector along the lines, and across them. */
  u: Point;
  v: Point;
  /** Lines in order across the family. */
  lines: { id: string; heads: { id: string; t: number }[]; feedT: number | null; offset: number }[];
  spacing: number;
  perHead: number;
  shape: AreaShape;
}

export interface Candidate {
  headIds: string[];
  lineIds: string[];
}

const PARALLEL_SIN = Math.sin((10 * Math.PI) / 180);
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.floor(s.length / 2)]! : NaN;
};

/** The given branch lines of the network grouped into families of parallel lines, each with its area shape. */
export function lineFamilies(
  network: Network,
  branchLines: BranchLine[],
  heads: Head[],
  coverage: Map<string, Coverage>,
  area: number,
): LineFamily[] {
  const pos = new Map(heads.map((h) => [h.id, h.position]));
  const nodePos = new Map(network.nodes.map((n) => [n.id, n.position]));
  const families: LineFamily[] = [];
  for (const line of branchLines.filter((b) => b.headIds.length)) {
    let fam = families.find((f) => Math.abs(cross(f.u, line.direction)) <= PARALLEL_SIN);
    if (!fam) {
      const d = line.direction;
      const u = d.x < -1e-12 || (Math.abs(d.x) <= 1e-12 && d.y < 0) ? { x: -d.x, y: -d.y } : d;
      fam = { u, v: { x: -u.y, y: u.x }, lines: [], spacing: 0, perHead: 0, shape: areaShape(area, 1, 1) };
      families.push(fam);
    }
    const f = fam;
    const hs = line.headIds.map((id) => ({ id, t: dot(pos.get(id)!, f.u) })).sort((a, b) => a.t - b.t);
    const feed = line.feedNodeIds[0];
    f.lines.push({
      id: line.id,
      heads: hs,
      feedT: feed ? dot(nodePos.get(feed)!, f.u) : null,
      offset: hs.reduce((s, h) => s + dot(pos.get(h.id)!, f.v), 0) / hs.length,
    });
  }
  for (const f of families) {
    f.lines.sort((a, b) => a.offset - b.offset);
    const ids = f.lines.flatMap((l) => l.heads.map((h) => h.id));
    const along = ids.map((id) => coverage.get(id)?.s).filter((x): x is number => typeof x === 'number' && x > 0);
    const areas = ids.map((id) => coverage.get(id)?.area).filter((x): x is number => typeof x === 'number' && x > 0);
    f.spacing = median(along);
    f.perHead = median(areas);
    if (!(f.spacing > 0) || !(f.perHead > 0)) continue;
    f.shape = areaShape(area, f.spacing, f.perHead);
  }
  return families.filter((f) => f.spacing > 0 && f.perHead > 0);
}

/**
 * The heads a window selects, in the order the rules add them: whole lines first, then on the next line the
 * heads nearest the cross main (its feed end). Keeps adding until `count` heads and `area` ft² are reached.
 */
function selectHeads(
  fam: LineFamily,
  start: number,
  dir: 1 | -1,
  t0: number,
  count: number,
  area: number,
  areaOf: (id: string) => number,
): Candidate {
  const lo = t0 - fam.spacing / 2;
  const hi = t0 + (fam.shape.headsAlong - 0.5) * fam.spacing;
  const headIds: string[] = [];
  const lineIds: string[] = [];
  let covered = 0;
  for (let j = start; j >= 0 && j < fam.lines.length; j += dir) {
    const line = fam.lines[j]!;
    // The line's heads are in order along it: the window is the run from the first at lo to the last before hi.
    const from = firstAtOrAfter(line.heads, lo - 1e-9);
    const to = firstAtOrAfter(line.heads, hi - 1e-9);
    if (from >= to) continue;
    lineIds.push(line.id);
    // Nearest the feed first: outwards from the feed point, the nearer of the two sides each time (the one
    // nearer the line's start on a tie).
    const feedT = line.feedT ?? line.heads[0]!.t;
    let right = Math.min(Math.max(firstAtOrAfter(line.heads, feedT), from), to);
    let left = right - 1;
    const gap = (k: number) => Math.abs(line.heads[k]!.t - feedT);
    while ((left >= from || right < to) && !(headIds.length >= count && covered >= area - 1e-6)) {
      const k = right >= to || (left >= from && gap(left) <= gap(right)) ? left-- : right++;
      headIds.push(line.heads[k]!.id);
      covered += areaOf(line.heads[k]!.id);
    }
    if (headIds.length >= count && covered >= area - 1e-6) break;
  }
  // Exact-length copies: an array grown by pushing keeps up to twice its length in slots, and a search keeps
  // tens of thousands of candidates.
  return { headIds: headIds.slice(), lineIds: lineIds.slice() };
}

/** Index of the first head at or after position t along the line (heads sorted by t). */
function firstAtOrAfter(heads: { t: number }[], t: number): number {
  let lo = 0;
  let hi = heads.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (heads[mid]!.t < t) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Every distinct candidate area of a family (windows that select the same heads are one area). */
export function candidatesOf(fam: LineFamily, areaOf: (id: string) => number, area: number): Candidate[] {
  const seen = distinctAreas(fam);
  const out: Candidate[] = [];
  const n = fam.shape.headsAlong;
  fam.lines.forEach((line, k) => {
    const starts = line.heads.length >= n ? line.heads.slice(0, line.heads.length - n + 1) : line.heads.slice(0, 1);
    for (const dir of [1, -1] as const) {
      for (const h of starts) {
        const c = selectHeads(fam, k, dir, h.t, fam.shape.totalHeads, area, areaOf);
        if (c.headIds.length && seen(c)) out.push(c);
      }
    }
  });
  // A window at the edge of the system that runs out of lines is no design area, unless no window has room.
  const full = out.filter((c) => c.headIds.length >= fam.shape.totalHeads);
  return full.length ? full : out;
}

/**
 * A test that is true the first time a set of heads is seen: candidates are filed by a hash of their head set
 * (the same whatever the order), and compared in full only with those of the same hash. No key string per
 * candidate is kept.
 */
function distinctAreas(fam: LineFamily): (c: Candidate) => boolean {
  const numberOf = new Map<string, number>();
  for (const line of fam.lines) for (const h of line.heads) numberOf.set(h.id, numberOf.size);
  const byHash = new Map<number, Candidate[]>();
  return (c) => {
    // Two 32-bit mixes of each head's number, summed and xor-ed (order-independent), make a 53-bit hash.
    let sum = 0;
    let xor = 0;
    for (const id of c.headIds) {
      const x = Math.imul((numberOf.get(id) ?? -1) + 1, 0x9e3779b1);
      sum = (sum + (x ^ (x >>> 15))) | 0;
      xor ^= Math.imul(x ^ (x >>> 13), 0x85ebca6b);
    }
    const hash = (sum >>> 0) * 0x200000 + ((xor >>> 0) & 0x1fffff);
    const same = byHash.get(hash);
    if (!same) {
      byHash.set(hash, [c]);
      return true;
    }
    if (same.some((o) => sameHeads(o.headIds, c.headIds))) return false;
    same.push(c);
    return true;
  };
}

/** Whether two lists of distinct head ids hold the same heads. */
function sameHeads(a: string[], b: string[]): boolean {
  if (a.length !== b.length) return false;
  const inA = new Set(a);
  return b.every((id) => inA.has(id));
}
