// Two checked revisions of a drawing compared: heads matched by handle (CAD keeps handles across edits), else by
// position within 1 in; findings by rule and (matched) handles, else by rule and position; pipes resized; areas.

import type { Point } from '../geometry/point.js';
import type { Reviewed } from '../outputs/reviewed.js';

/** How close two positions must be to be the same place, ft (1 in: CONTRACT.md, "Comparing revisions"). */
export const SAME_PLACE_FT = 1 / 12;
/** A head that kept its handle and moved less than this did not move (rounding in CAD), ft. */
const STILL_FT = 1e-6;

export interface HeadChange {
  handle: string;
  at: Point;
}
export interface HeadMove {
  handle: string;
  /** The handle in the earlier drawing (the same unless the head was matched by position). */
  beforeHandle: string;
  from: Point;
  to: Point;
  distance: number;
}
/** A finding of one revision, by its index in that revision's findings. */
export interface FindingRef {
  index: number;
}
export interface Comparison {
  findings: { resolved: FindingRef[]; added: FindingRef[]; unchanged: { before: number; after: number }[] };
  heads: { added: HeadChange[]; removed: HeadChange[]; moved: HeadMove[]; matchedByPosition: number };
  pipes: { resized: { handles: string[]; before: string; after: string }[] };
}

export function compareRevisions(before: Reviewed, after: Reviewed): Comparison {
  const heads = matchHeads(before, after);
  const gone = new Set(heads.changes.removed.map((h) => h.handle));
  const fresh = new Set(heads.changes.added.map((h) => h.handle));
  return {
    findings: matchFindings(before, after, heads.afterToBefore, { gone, fresh }),
    heads: heads.changes,
    pipes: { resized: resizedPipes(before, after) },
  };
}

/** Points bucketed by cells of SAME_PLACE_FT: the neighbours of a point are in its cell and the eight around it. */
class PlaceIndex<T> {
  private readonly cells = new Map<string, { at: Point; item: T }[]>();
  private key = (x: number, y: number) => `${x},${y}`;
  add(at: Point, item: T): void {
    const k = this.key(Math.floor(at.x / SAME_PLACE_FT), Math.floor(at.y / SAME_PLACE_FT));
    const cell = this.cells.get(k);
    if (cell) cell.push({ at, item });
    else this.cells.set(k, [{ at, item }]);
  }
  /** The nearest item within SAME_PLACE_FT that `free` accepts, or null. */
  nearest(at: Point, free: (item: T) => boolean): T | null {
    const cx = Math.floor(at.x / SAME_PLACE_FT);
    const cy = Math.floor(at.y / SAME_PLACE_FT);
    let best: T | null = null;
    let bestD = SAME_PLACE_FT;
    for (let dx = -1; dx <= 1; dx++)
      for (let dy = -1; dy <= 1; dy++)
        for (const e of this.cells.get(this.key(cx + dx, cy + dy)) ?? []) {
          const d = Math.hypot(e.at.x - at.x, e.at.y - at.y);
          if (d <= bestD && free(e.item)) {
            best = e.item;
            bestD = d;
          }
        }
    return best;
  }
}

function matchHeads(before: Reviewed, after: Reviewed) {
  const byHandle = new Map(before.plan.heads.map((h) => [h.handle, h]));
  const taken = new Set<string>();
  const afterToBefore = new Map<string, string>();
  const moved: HeadMove[] = [];
  const unmatched = [];
  for (const h of after.plan.heads) {
    const b = byHandle.get(h.handle);
    if (!b || taken.has(b.handle)) {
      unmatched.push(h);
      continue;
    }
    taken.add(b.handle);
    afterToBefore.set(h.handle, b.handle);
    const distance = Math.hypot(h.position.x - b.position.x, h.position.y - b.position.y);
    if (distance > STILL_FT) moved.push({ handle: h.handle, beforeHandle: b.handle, from: b.position, to: h.position, distance });
  }
  // The rest by place: a head drawn anew where one was (new handle) is the same head.
  const places = new PlaceIndex<(typeof before.plan.heads)[number]>();
  for (const b of before.plan.heads) if (!taken.has(b.handle)) places.add(b.position, b);
  const added: HeadChange[] = [];
  let matchedByPosition = 0;
  for (const h of unmatched) {
    const b = places.nearest(h.position, (x) => !taken.has(x.handle));
    if (!b) {
      added.push({ handle: h.handle, at: h.position });
      continue;
    }
    taken.add(b.handle);
    afterToBefore.set(h.handle, b.handle);
    matchedByPosition++;
  }
  const removed = before.plan.heads.filter((b) => !taken.has(b.handle)).map((b) => ({ handle: b.handle, at: b.position }));
  return { afterToBefore, changes: { added, removed, moved, matchedByPosition } };
}

/**
 * Findings by rule and handles (the later drawing's head handles read as the earlier ones they matched), else by
 * rule and place; a finding naming a head that was removed (earlier) or added (later) is about that head, and is
 * never paired by place with another head's.
 */
function matchFindings(
  before: Reviewed,
  after: Reviewed,
  afterToBefore: Map<string, string>,
  heads: { gone: Set<string>; fresh: Set<string> },
): Comparison['findings'] {
  const keyOf = (rule: string, handles: string[]) => (handles.length ? `${rule}|${[...handles].sort().join(',')}` : null);
  // Earlier findings by rule and handles (a list: two findings may share both).
  const byKey = new Map<string, number[]>();
  before.findings.forEach((f, i) => {
    const key = keyOf(f.rule, f.handles);
    if (key) byKey.set(key, [...(byKey.get(key) ?? []), i]);
  });
  const used = new Uint8Array(before.findings.length);
  const pairs: { before: number; after: number }[] = [];
  const left: number[] = [];
  after.findings.forEach((f, i) => {
    const key = keyOf(
      f.rule,
      f.handles.map((h) => afterToBefore.get(h) ?? h),
    );
    const j = key ? byKey.get(key)?.find((x) => !used[x]) : undefined;
    if (j === undefined) {
      left.push(i);
      return;
    }
    used[j] = 1;
    pairs.push({ before: j, after: i });
  });
  // Else by rule and place.
  const places = new PlaceIndex<number>();
  before.findings.forEach((f, j) => {
    if (!used[j] && !f.handles.some((h) => heads.gone.has(h))) places.add(f.at, j);
  });
  const added: FindingRef[] = [];
  for (const i of left) {
    const f = after.findings[i]!;
    const j = f.handles.some((h) => heads.fresh.has(h))
      ? null
      : places.nearest(f.at, (x) => !used[x] && before.findings[x]!.rule === f.rule);
    if (j === null) {
      added.push({ index: i });
      continue;
    }
    used[j] = 1;
    pairs.push({ before: j, after: i });
  }
  const resolved = before.findings.flatMap((_, j) => (used[j] ? [] : [{ index: j }]));
  return { resolved, added, unchanged: pairs.sort((a, b) => a.after - b.after) };
}

/** Pipes drawn from the same entity (handle) whose nominal size changed. */
function resizedPipes(before: Reviewed, after: Reviewed): Comparison['pipes']['resized'] {
  const sizeOf = new Map<string, string>();
  for (const p of before.network.pipes) for (const h of p.handles) sizeOf.set(h, p.nominalSize);
  const seen = new Set<string>();
  const resized: Comparison['pipes']['resized'] = [];
  for (const p of after.network.pipes) {
    const was = p.handles.map((h) => sizeOf.get(h)).find((s) => s !== undefined && s !== p.nominalSize);
    const key = p.handles.join(',');
    if (was === undefined || seen.has(key)) continue;
    seen.add(key);
    resized.push({ handles: p.handles, before: was, after: p.nominalSize });
  }
  return resized;
}
