// Groups pipes into straight runs: at every node the two most nearly collinear pipes continue one run;
// a node with two pipes also continues it when a head sits there (a line turning at a head). Where three or
// more pipes meet, only pipes of one size continue a run: a main crossing straight into a branch line does not.

import { dot, sub, unit, type Point } from '../geometry/point.js';

export interface RunPipe {
  from: number;
  to: number;
  points: Point[];
  size: string;
}

/** Runs continue through a node when the pipes deviate from straight by at most this angle (common practice). */
const STRAIGHT_COS = Math.cos((25 * Math.PI) / 180);

/** Run index of each pipe. */
export function groupRuns(nodeCount: number, pipes: RunPipe[], hasHead: (node: number) => boolean): number[] {
  const parent = pipes.map((_, i) => i);
  /** The root of i's set, with the path compressed (a loop: a run may hold a hundred thousand pipes). */
  const find = (i: number): number => {
    let root = i;
    while (parent[root] !== root) root = parent[root]!;
    for (let at = i; parent[at] !== root; ) {
      const up = parent[at]!;
      parent[at] = root;
      at = up;
    }
    return root;
  };
  const union = (a: number, b: number) => {
    parent[find(a)] = find(b);
  };
  const incident: number[][] = Array.from({ length: nodeCount }, () => []);
  pipes.forEach((p, i) => {
    incident[p.from]!.push(i);
    incident[p.to]!.push(i);
  });

  /** Direction leaving node n along pipe i. */
  const outward = (n: number, i: number): Point => {
    const pts = pipes[i]!.points;
    return pipes[i]!.from === n ? unit(sub(pts[1]!, pts[0]!)) : unit(sub(pts[pts.length - 2]!, pts[pts.length - 1]!));
  };

  incident.forEach((list, n) => {
    if (list.length === 2 && hasHead(n)) {
      union(list[0]!, list[1]!);
      return;
    }
    const free = new Set(list);
    const pairs: { i: number; j: number; straight: number }[] = [];
    for (let x = 0; x < list.length; x++) {
      for (let y = x + 1; y < list.length; y++) {
        if (list.length > 2 && pipes[list[x]!]!.size !== pipes[list[y]!]!.size) continue;
        pairs.push({ i: list[x]!, j: list[y]!, straight: -dot(outward(n, list[x]!), outward(n, list[y]!)) });
      }
    }
    pairs.sort((p, q) => q.straight - p.straight);
    for (const p of pairs) {
      if (p.straight < STRAIGHT_COS) break;
      if (free.has(p.i) && free.has(p.j)) {
        union(p.i, p.j);
        free.delete(p.i);
        free.delete(p.j);
      }
    }
  });
  const ids = new Map<number, number>();
  return pipes.map((_, i) => {
    const root = find(i);
    if (!ids.has(root)) ids.set(root, ids.size);
    return ids.get(root)!;
  });
}
