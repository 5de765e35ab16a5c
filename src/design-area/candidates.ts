// Candidate design areas on the rebuilt network: for each family of parallel branch lines, each starting line,
// each direction across the lines and each start along them, the whole lines the shape rules select and every
// placement of the heads left over on the next line (from its cross-main end to under the rectangle).

import { cross, dot, type Point } from '../geometry/point.js';
import type { BranchLine, Network } from '../network/types.js';
import type { Head } from '../read/plan.js';
import type { Coverage } from '../coverage/coverage.js';
import { areaShape, type AreaShape } from './shape.js';
import { lowerBound } from '../arrays.js';

export interface LineFamily {
  /** Unit vector along the lines, and across them. */
  u: Point;
  v: Point;
  /** Lines in order across the family, each with its heads in order along it and its own head spacing, ft. */
  lines: FamilyLine[];
  spacing: number;
  perHead: number;
  shape: AreaShape;
}

export interface FamilyLine {
  id: string;
  heads: { id: string; t: number }[];
  /** The heads' ids in the same order (one array, shared by every group whose leftover goes on this line). */
  ids: string[];
  /** Where the line meets its mains, along it (two for a line of a grid; none where no main was found). */
  feedTs: number[];
  offset: number;
  spacing: number;
}

export interface Candidate {
  headIds: string[];
  lineIds: string[];
}

/**
 * Candidates that share their whole lines: `base` and every placement of `size` leftover heads on the next line,
 * the runs of `next.heads` starting at `first` … `last`. No leftover (or no next line) is one candidate.
 */
export interface CandidateGroup {
  base: string[];
  lines: string[];
  next: { line: string; heads: readonly string[]; first: number; last: number; size: number } | null;
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

    f.lines.push({
      id: line.id,
      heads: hs,
      ids: hs.map((h) => h.id),
      feedTs: line.feedNodeIds.map((n) => dot(nodePos.get(n)!, f.u)),
      offset: hs.reduce((s, h) => s + dot(pos.get(h.id)!, f.v), 0) / hs.length,
      spacing: median(hs.slice(1).map((h, i) => h.t - hs[i]!.t)),
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
    // A line of one head takes the family's spacing.
    for (const l of f.lines) if (!(l.spacing > 0)) l.spacing = f.spacing;
  }
  return families.filter((f) => f.spacing > 0 && f.perHead > 0);
}

/** The target an area must reach: `count` heads covering `area` ft²; what each head of each line covers, by place. */
interface Target {
  count: number;
  area: number;
  areas: Float64Array[];
}

/**
 * Where one start's area lies, before it is built: from line `start` across the family, each whole line's window
 * of heads (`windows`: line, first head, end, … in the order taken) and the leftover on the next line, if any.
 */
interface Sketch {
  windows: number[];
  heads: number;
  next: { line: number; first: number; last: number; size: number } | null;
}

/**
 * The candidates of one start: from line `start` across the family in direction `dir`, the area's edge along the
 * lines at `edge`. Each line takes its own number of heads along (1.2·√A over its own spacing) from the edge;
 * whole lines are taken while the target is not reached, and the heads still wanting go on the next line as a
 * run anywhere between its cross-main end and the rectangle.
 */
function sketchAt(fam: LineFamily, start: number, dir: 1 | -1, edge: number, target: Target): Sketch {
  const windows: number[] = [];
  let heads = 0;
  let covered = 0;
  const reached = (count: number, area: number) => count >= target.count && area >= target.area - 1e-6;
  for (let j = start; j >= 0 && j < fam.lines.length; j += dir) {
    const line = fam.lines[j]!;
    const along = Math.max(1, Math.ceil(fam.shape.minLength / line.spacing - 1e-9));
    const from = firstAtOrAfter(line.heads, edge - 1e-9);
    const to = Math.min(line.heads.length, from + along);
    if (from >= to) continue;
    let windowArea = 0;
    const areas = target.areas[j]!;
    for (let k = from; k < to; k++) windowArea += areas[k]!;
    if (!reached(heads + to - from, covered + windowArea) || heads + to - from === target.count) {
      windows.push(j, from, to);
      heads += to - from;
      covered += windowArea;
      if (reached(heads, covered)) break;
      continue;
    }
    // The leftover: as many heads as the nearest-the-feed order within the window needs to reach the target.
    // The cross-main end nearest the rectangle (a grid's line has one at each end).
    const middle = (line.heads[from]!.t + line.heads[to - 1]!.t) / 2;
    const feedT = line.feedTs.length
      ? line.feedTs.reduce((a, b) => (Math.abs(b - middle) < Math.abs(a - middle) ? b : a))
      : line.heads[0]!.t;
    // Nearest first: out from the feed both ways along the window (the heads are in order along the line; of two
    // as near on the two sides, the one before).
    let size = 0;
    let area = covered;
    let after = Math.min(Math.max(firstAtOrAfter(line.heads, feedT), from), to);
    let before = after - 1;
    const distance = (k: number) => Math.abs(line.heads[k]!.t - feedT);
    while (before >= from || after < to) {
      const k = after >= to || (before >= from && distance(before) <= distance(after)) ? before-- : after++;
      size++;
      area += areas[k]!;
      if (reached(heads + size, area)) break;
    }
    // Runs of `size` heads lying between the feed end and the far side of the window.
    const lo = Math.min(feedT, line.heads[from]!.t) - 1e-6;
    const hi = Math.max(feedT, line.heads[to - 1]!.t) + 1e-6;
    const first = firstAtOrAfter(line.heads, lo);
    const last = firstAtOrAfter(line.heads, hi) - size;
    return { windows, heads, next: { line: j, first, last: Math.max(first, last), size } };
  }
  return { windows, heads, next: null };
}

/** The group a sketch describes, its arrays of exact length (a search keeps tens of thousands of groups). */
function groupOf(fam: LineFamily, sketch: Sketch): CandidateGroup {
  const base = new Array<string>(sketch.heads);
  const lines = new Array<string>(sketch.windows.length / 3);
  let at = 0;
  for (let w = 0; w < sketch.windows.length; w += 3) {
    const line = fam.lines[sketch.windows[w]!]!;
    lines[w / 3] = line.id;
    for (let k = sketch.windows[w + 1]!; k < sketch.windows[w + 2]!; k++) base[at++] = line.ids[k]!;
  }
  const n = sketch.next;
  const line = n && fam.lines[n.line]!;
  return { base, lines, next: n && line ? { line: line.id, heads: line.ids, first: n.first, last: n.last, size: n.size } : null };
}

/** Index of the first head at or after position t along the line (heads sorted by t). */
const firstAtOrAfter = (heads: { t: number }[], t: number): number => lowerBound(heads.length, (k) => heads[k]!.t, t);

/**
 * Every distinct group of candidate areas of a family. Starts sharing whole lines and next line are one group,
 * their leftover placements joined (each range holds the cross-main end, so they overlap).
 */
export function candidateGroupsOf(fam: LineFamily, areaOf: (id: string) => number, area: number): CandidateGroup[] {
  const target: Target = { count: fam.shape.totalHeads, area, areas: fam.lines.map((l) => Float64Array.from(l.ids, areaOf)) };
  /** The groups by the hash of their whole lines' heads (a number: tens of thousands of string keys weigh megabytes). */
  const byHash = new Map<number, CandidateGroup[]>();
  const out: CandidateGroup[] = [];
  const hashOf = headSetHash(fam);
  /** Whether a group is the one a sketch describes: the same whole lines' heads, next line and leftover. */
  const sameAs = (g: CandidateGroup, sketch: Sketch) =>
    g.base.length === sketch.heads &&
    (g.next?.line ?? null) === (sketch.next ? fam.lines[sketch.next.line]!.id : null) &&
    (g.next?.size ?? 0) === (sketch.next?.size ?? 0);
  fam.lines.forEach((line, k) => {
    for (const dir of [1, -1] as const) {
      for (const h of line.heads) {
        const sketch = sketchAt(fam, k, dir, h.t - line.spacing / 2, target);
        if (sketch.heads === 0 && !sketch.next) continue;
        const hash = hashOf(sketch);
        const bucket = byHash.get(hash);
        const same = bucket?.find((g) => sameAs(g, sketch));
        if (!same) {
          const g = groupOf(fam, sketch);
          if (bucket) bucket.push(g);
          else byHash.set(hash, [g]);
          out.push(g);
        } else if (same.next && sketch.next) {
          same.next.first = Math.min(same.next.first, sketch.next.first);
          same.next.last = Math.max(same.next.last, sketch.next.last);
        }
      }
    }
  });
  // A start at the edge of the system that runs out of lines is no design area, unless no start has room.
  const full = out.filter((g) => g.base.length + (g.next?.size ?? 0) >= fam.shape.totalHeads);
  return full.length ? full : out;
}

/** The candidates of a group: its whole lines with each placement of the leftover. */
export function membersOf(g: CandidateGroup): Candidate[] {
  if (!g.next) return [{ headIds: g.base, lineIds: g.lines }];
  const lineIds = [...g.lines, g.next.line];
  return runsOf(g).map((run) => ({ headIds: [...g.base, ...run], lineIds }));
}

/** The placements of a group's leftover heads (none for a group without). */
export function runsOf(g: CandidateGroup): string[][] {
  if (!g.next) return [];
  const { heads, first, size } = g.next;
  const out: string[][] = [];
  for (let k = first; k <= lastRun(g); k++) out.push(heads.slice(k, k + size));
  return out;
}

/** Every head any candidate of the group flows: its whole lines and the next line's heads its runs cover. */
export function unionOf(g: CandidateGroup): string[] {
  if (!g.next) return g.base;
  const { heads, first, size } = g.next;
  return [...g.base, ...heads.slice(first, lastRun(g) + size)];
}

/**
 * Every head any of the groups' candidates flows, once, in the order of the groups' unions one after the other.
 * Built without the unions: a start's whole lines are seen once where groups share them, and of each next line
 * only the heads not yet seen there are looked up. The unions of the bench's 20,000 heads in lines of 8 hold 681,404
 * ids, those of its 20,070 heads in long lines 4.9 million.
 */
export function headsOfAnyGroup(groups: readonly CandidateGroup[]): string[] {
  const heads = new Set<string>();
  const bases = new Set<readonly string[]>();
  const seenOnLine = new Map<readonly string[], Uint8Array>();
  for (const g of groups) {
    if (!bases.has(g.base)) {
      bases.add(g.base);
      for (const id of g.base) heads.add(id);
    }
    if (!g.next) continue;
    const line = g.next.heads;
    let seen = seenOnLine.get(line);
    if (!seen) seenOnLine.set(line, (seen = new Uint8Array(line.length)));
    const end = Math.min(line.length, lastRun(g) + g.next.size);
    for (let i = g.next.first; i < end; i++) {
      if (seen[i]) continue;
      seen[i] = 1;
      heads.add(line[i]!);
    }
  }
  return [...heads];
}

/** The start of a group's last leftover placement (runs end with the line). */
export const lastRun = (g: CandidateGroup): number => (g.next ? Math.min(g.next.last, g.next.heads.length - g.next.size) : 0);

/** How many candidates a group holds. */
export const memberCount = (g: CandidateGroup): number => (g.next ? Math.max(0, lastRun(g) - g.next.first + 1) : 1);

/**
 * A hash of a start's whole lines' heads, the same for two starts with the same heads: 53 bits of the heads'
 * numbers in the family, order-independent (two sets of heads are taken as one where their hashes agree).
 */
function headSetHash(fam: LineFamily): (sketch: Sketch) => number {
  const firstNumber = new Int32Array(fam.lines.length);
  for (let j = 1; j < fam.lines.length; j++) firstNumber[j] = firstNumber[j - 1]! + fam.lines[j - 1]!.heads.length;
  return (sketch) => {
    let sum = 0;
    let xor = 0;
    for (let w = 0; w < sketch.windows.length; w += 3) {
      const j = sketch.windows[w]!;
      for (let k = sketch.windows[w + 1]!; k < sketch.windows[w + 2]!; k++) {
        const x = Math.imul(firstNumber[j]! + k + 1, 0x9e3779b1);
        sum = (sum + (x ^ (x >>> 15))) | 0;
        xor ^= Math.imul(x ^ (x >>> 13), 0x85ebca6b);
      }
    }
    return (sum >>> 0) * 0x200000 + ((xor >>> 0) & 0x1fffff);
  };
}
