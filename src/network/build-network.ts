// The network stage: pipe strokes, heads and the source of a Plan into a Network — nodes, sized pipes,
// straight runs classed as branch lines, cross mains, feed mains and drops, loops and disconnected parts.

import type { Settings } from '../config/settings.js';
import { distance, dot, sub, unit, type Point } from '../geometry/point.js';
import { fail } from '../input-error.js';
import type { Plan } from '../read/plan.js';
import { INSIDE_DIAMETER, type NominalSize } from '../quantities/pipe-sizes.js';
import { groupRuns } from './runs.js';
import { sizesFromLabels } from './size-labels.js';
import { snapStrokes, type Edge } from './snap.js';
import type { BranchLine, DisconnectedPart, NetNode, NetPipe, NetSystem, Network } from './types.js';
import { minOf, pushAll } from '../arrays.js';
import { grouped, incidence, type Grouped } from './incidence.js';

/** A source symbol may sit up to 2 ft from the pipe it feeds (common practice, no source). */
export const SOURCE_REACH_FT = 2;
/** A pipe to a single head no longer than this, off a line, is a drop or arm-over (common practice, no source). */
const DROP_MAX_FT = 3;
/** Direction changes above this count as an elbow (common practice, no source). */
const BEND_MIN_RAD = (30 * Math.PI) / 180;

export function buildNetwork(plan: Plan, settings: Settings): Network {
  const defaultSize = settings.defaults.pipeSize;
  const tol = settings.tolerances;
  const { sizes: strokeSizes, unread } = sizesFromLabels(plan.pipes, plan.labels, tol.sizeLabel);
  const attachPoints = [
    ...plan.heads.map((h) => ({ at: h.position, reach: tol.headAttach })),
    ...plan.sources.map((s) => ({ at: s.position, reach: Math.max(SOURCE_REACH_FT, tol.headAttach) })),
  ];
  const g = snapStrokes(plan.pipes, attachPoints, tol.snap);
  const maxNodes = settings.inputLimits.networkNodes;
  if (g.nodes.length > maxNodes) fail(`the piping has ${g.nodes.length} nodes, over the limit of ${maxNodes} (inputLimits.networkNodes)`);
  const headAt = new Map<number, string>();
  plan.heads.forEach((h, i) => {
    const n = g.attached[i]!;
    if (n >= 0 && !headAt.has(n)) headAt.set(n, h.id);
  });
  const sourceRaws = plan.sources.map((_, i) => g.attached[plan.heads.length + i]!);
  const isSourceRaw = new Set(sourceRaws.filter((n) => n >= 0));

  const chains = mergeChains(
    g.nodes.length,
    g.edges,
    (n) => headAt.has(n) || isSourceRaw.has(n),
    (e) => strokeSizes[e.stroke] ?? null,
  );
  // Renumber the nodes that remain pipe ends, in the order the pipes reach them.
  const kept: number[] = [];
  const keep = new Int32Array(g.nodes.length).fill(-1);
  for (const c of chains) {
    for (const raw of [c.from, c.to]) {
      if (keep[raw]! >= 0) continue;
      keep[raw] = kept.length;
      kept.push(raw);
    }
  }
  const nodes: NetNode[] = kept.map((raw, i) => ({
    id: `N${i + 1}`,
    position: g.nodes[raw]!,
    isSource: isSourceRaw.has(raw),
    ...(headAt.has(raw) ? { headId: headAt.get(raw)! } : {}),
  }));
  const ends = { from: Int32Array.from(chains, (c) => keep[c.from]!), to: Int32Array.from(chains, (c) => keep[c.to]!) };
  const schedule = settings.defaults.schedule;
  const runs = groupRuns(
    nodes.length,
    chains.map((c, i) => ({ from: ends.from[i]!, to: ends.to[i]!, points: c.points, size: c.size ?? defaultSize })),
    (n) => nodes[n]!.headId !== undefined,
  );
  const pipes: NetPipe[] = chains.map((c, i) => {
    const size = c.size ?? defaultSize;
    return {
      id: `P${i + 1}`,
      from: nodes[ends.from[i]!]!.id,
      to: nodes[ends.to[i]!]!.id,
      handles: [...new Set(c.edges.map((e) => plan.pipes[e.stroke]!.handle))],
      points: c.points,
      length: c.length,
      bends: c.bends,
      nominalSize: size,
      sizeFrom: c.size ? 'label' : 'default',
      unreadLabels: [...new Set(c.edges.flatMap((e) => unread.get(e.stroke) ?? []))],
      innerDiameter: INSIDE_DIAMETER[schedule][size],
      cFactor: settings.defaults.cFactor,
      role: 'unknown',
      run: runs[i]!,
    };
  });
  // Each head's node: the first head at a node, then heads attached where another one sits.
  const headNode: Record<string, string> = {};
  const headNodeIndex = new Map<string, number>();
  const setHeadNode = (headId: string, raw: number) => {
    const v = keep[raw]!;
    headNode[headId] = nodes[v]!.id;
    headNodeIndex.set(headId, v);
  };
  for (const [raw, headId] of headAt) setHeadNode(headId, raw);
  plan.heads.forEach((h, i) => {
    const raw = g.attached[i]!;
    if (raw >= 0 && keep[raw]! >= 0 && !headNode[h.id]) setHeadNode(h.id, raw);
  });
  const sources = plan.sources.map((s, i) => {
    const raw = sourceRaws[i]!;
    return { handle: s.handle, node: raw >= 0 ? keep[raw]! : -1 };
  });
  return classify({
    nodes,
    pipes,
    ends,
    headNode,
    headNodeIndex,
    sources,
    unattachedHeadIds: plan.heads.filter((h) => !headNode[h.id]).map((h) => h.id),
    headOrder: plan.heads.map((h) => h.id),
  });
}

interface Chain {
  from: number;
  to: number;
  edges: Edge[];
  points: Point[];
  length: number;
  bends: number;
  size: NominalSize | null;
}

/** Joins edges through plain two-pipe nodes (no head, no source, same size) into one pipe each. */
function mergeChains(nodeCount: number, edges: Edge[], pinned: (n: number) => boolean, sizeOf: (e: Edge) => NominalSize | null): Chain[] {
  const incident: number[][] = Array.from({ length: nodeCount }, () => []);
  edges.forEach((e, i) => {
    incident[e.a]!.push(i);
    incident[e.b]!.push(i);
  });
  const through = (n: number) =>
    incident[n]!.length === 2 && !pinned(n) && sizeOf(edges[incident[n]![0]!]!) === sizeOf(edges[incident[n]![1]!]!);
  const used = new Set<number>();
  const chains: Chain[] = [];
  const walk = (start: number, first: number): Chain => {
    const list: Edge[] = [];
    const points: Point[] = [];
    let node = start;
    let ei = first;
    for (;;) {
      used.add(ei);
      const e = edges[ei]!;
      const forward = e.a === node;
      const pts = forward ? e.points : [...e.points].reverse();
      pushAll(points, points.length ? pts.slice(1) : pts);
      list.push(e);
      node = forward ? e.b : e.a;
      if (!through(node) || node === start) break;
      const next = incident[node]!.find((x) => !used.has(x));
      if (next === undefined) break;
      ei = next;
    }
    let length = 0;
    for (let k = 1; k < points.length; k++) length += distance(points[k - 1]!, points[k]!);
    return { from: start, to: node, edges: list, points, length, bends: countBends(points, list), size: sizeOf(list[0]!) };
  };
  for (let n = 0; n < nodeCount; n++) {
    if (through(n)) continue;
    for (const ei of incident[n]!) if (!used.has(ei)) chains.push(walk(n, ei));
  }
  edges.forEach((e, i) => {
    if (!used.has(i)) chains.push(walk(e.a, i));
  }); // closed rings of plain nodes
  return chains.filter((c) => c.from !== c.to || c.length > 0);
}

/** Elbows along a chain: corners between straight edges turning by more than 30°; arcs are swept bends, not fittings. */
function countBends(points: Point[], edges: Edge[]): number {
  if (edges.some((e) => e.points.length > 2)) return 0;
  let bends = 0;
  for (let k = 1; k + 1 < points.length; k++) {
    const u = unit(sub(points[k]!, points[k - 1]!));
    const v = unit(sub(points[k + 1]!, points[k]!));
    if (Math.acos(Math.max(-1, Math.min(1, dot(u, v)))) > BEND_MIN_RAD) bends++;
  }
  return bends;
}

/** The network before its roles: nodes and pipes, each pipe's end nodes by index, heads' nodes and sources'. */
interface Unclassified {
  nodes: NetNode[];
  pipes: NetPipe[];
  /** Each pipe's end nodes, as indices into `nodes`. */
  ends: { from: Int32Array; to: Int32Array };
  headNode: Record<string, string>;
  headNodeIndex: Map<string, number>;
  /** Each source's node index, −1 where it is on no pipe. */
  sources: { handle: string; node: number }[];
  unattachedHeadIds: string[];
  headOrder: string[];
}

/** The graph as `classify` walks it: each pipe's end nodes and the pipes at each node (`otherEnd` crosses a pipe). */
interface Graph {
  from: Int32Array;
  to: Int32Array;
  start: Int32Array;
  incident: Int32Array;
}

const otherEnd = (g: Graph, pipe: number, node: number): number => (g.from[pipe] === node ? g.to[pipe]! : g.from[pipe]!);

/** Roles, branch lines, topology and disconnected parts (nodes and pipes by index: 20,000 heads). */
function classify({ nodes, pipes, ends, headNode, headNodeIndex, sources, unattachedHeadIds, headOrder }: Unclassified): Network {
  const n = nodes.length;
  const g: Graph = { ...ends, ...incidence(n, ends.from, ends.to) };
  const { from, to, start, incident } = g;
  const degree = (v: number) => start[v + 1]! - start[v]!;
  const hasHead = (v: number) => nodes[v]!.headId !== undefined;
  const runCount = pipes.reduce((m, p) => Math.max(m, p.run + 1), 0);
  const byRun = grouped(runCount, [Int32Array.from(pipes, (p) => p.run)]);

  // Drops: a short pipe to a lone head, on a run of its own.
  const isDrop = (k: number) => {
    const p = pipes[k]!;
    if (p.length > DROP_MAX_FT || byRun.start[p.run + 1]! - byRun.start[p.run]! !== 1) return false;
    const [leaf, root] = degree(to[k]!) === 1 && hasHead(to[k]!) ? [to[k]!, from[k]!] : [from[k]!, to[k]!];
    return degree(leaf) === 1 && hasHead(leaf) && degree(root) >= 2 && !hasHead(root);
  };
  pipes.forEach((p, k) => {
    if (isDrop(k)) p.role = 'drop';
  });
  /** The runs of the pipes at a node, drops aside, each once, in pipe order. */
  const runsAt = (v: number): number[] => {
    const runs: number[] = [];
    for (let i = start[v]!; i < start[v + 1]!; i++) {
      const p = pipes[incident[i]!]!;
      if (p.role !== 'drop' && !runs.includes(p.run)) runs.push(p.run);
    }
    return runs;
  };

  // Heads of each run (their nodes): on its nodes, or at the end of its drops; runs in the order they get a first head.
  const runHeads: number[][] = [];
  const branchRuns: number[] = [];
  const isBranchRun = new Uint8Array(runCount);
  const headInRun = new Set<number>();
  const addHead = (run: number, v: number) => {
    const key = run * n + v;
    if (headInRun.has(key)) return;
    headInRun.add(key);
    if (!isBranchRun[run]) {
      isBranchRun[run] = 1;
      branchRuns.push(run);
      runHeads[run] = [];
    }
    runHeads[run]!.push(v);
  };
  pipes.forEach((p, k) => {
    if (p.role === 'drop') {
      const leaf = hasHead(to[k]!) && degree(to[k]!) === 1 ? to[k]! : from[k]!;
      for (const r of runsAt(otherEnd(g, k, leaf))) addHead(r, leaf);
    } else {
      for (const v of [from[k]!, to[k]!]) if (hasHead(v)) addHead(p.run, v);
    }
  });

  // Reachability from each source, and heads carried downstream (over a breadth-first spanning forest, one
  // tree per system). A source on piping an earlier source already reached shares that system.
  const systemOf = new Int32Array(n).fill(-1);
  const order: number[] = [];
  const parentPipe = new Int32Array(n).fill(-1);
  const systemRoots: { handle: string; node: number; shared: string[]; first: number }[] = [];
  for (const s of sources) {
    if (s.node < 0) continue;
    if (systemOf[s.node]! >= 0) {
      systemRoots[systemOf[s.node]!]!.shared.push(s.handle);
      continue;
    }
    const k = systemRoots.length;
    systemRoots.push({ handle: s.handle, node: s.node, shared: [], first: order.length });
    systemOf[s.node] = k;
    order.push(s.node);
    for (let i = order.length - 1; i < order.length; i++) {
      const v = order[i]!;
      for (let j = start[v]!; j < start[v + 1]!; j++) {
        const w = otherEnd(g, incident[j]!, v);
        if (systemOf[w]! < 0) {
          systemOf[w] = k;
          order.push(w);
          parentPipe[w] = incident[j]!;
        }
      }
    }
  }
  const carried = new Int32Array(pipes.length);
  const below = new Int32Array(n);
  for (const v of order) below[v] = hasHead(v) ? 1 : 0;
  for (let i = order.length - 1; i >= 0; i--) {
    const v = order[i]!;
    const p = parentPipe[v]!;
    if (p < 0) continue; // a system's source
    carried[p] = below[v]!;
    below[otherEnd(g, p, v)]! += below[v]!;
  }
  /** Whether the pipe is a tree edge (it carries flow to the part below it). */
  const isTreeEdge = (k: number) => parentPipe[to[k]!] === k || parentPipe[from[k]!] === k;

  // Mains: runs without heads; a run touching two or more branch lines is a cross main. Counted per run, once
  // (a cross main of 2,500 pipes would otherwise walk its 2,500 nodes for each of them).
  const touchingCount = new Map<number, number>();
  const branchesTouching = (run: number) => {
    let count = touchingCount.get(run);
    if (count === undefined) {
      const touching = new Set<number>();
      for (let i = byRun.start[run]!; i < byRun.start[run + 1]!; i++) {
        const k = byRun.members[i]!;
        if (pipes[k]!.role === 'drop') continue;
        for (const v of [from[k]!, to[k]!]) for (const r of runsAt(v)) if (r !== run && isBranchRun[r]) touching.add(r);
      }
      touchingCount.set(run, (count = touching.size));
    }
    return count;
  };
  pipes.forEach((p, k) => {
    if (p.role === 'drop') return;
    if (isBranchRun[p.run]) p.role = 'branch';
    else if (branchesTouching(p.run) >= 2) p.role = 'cross-main';
    else if (systemOf[from[k]!]! >= 0 && (carried[k]! > 0 || !isTreeEdge(k))) p.role = 'feed-main';
  });
  /** The run of the first main at a node, or null. */
  const mainRunAt = (v: number): number | null => {
    for (let i = start[v]!; i < start[v + 1]!; i++) {
      const p = pipes[incident[i]!]!;
      if (p.role === 'cross-main' || p.role === 'feed-main') return p.run;
    }
    return null;
  };

  const lines = buildBranchLines(nodes, pipes, g, byRun, branchRuns, runHeads, headOrder, (v) => mainRunAt(v) !== null);
  const branchLines = lines.map((l) => l.line);
  const systems = systemRoots.map((root, k): NetSystem => {
    const nodeIds = order.slice(root.first, systemRoots[k + 1]?.first ?? order.length).map((v) => nodes[v]!.id);
    const pipeIds = pipes.filter((_, j) => systemOf[from[j]!] === k).map((p) => p.id);
    const own = lines.filter((l) => systemOf[from[l.firstPipe]!] === k);
    const loops = Math.max(0, pipeIds.length - nodeIds.length + 1);
    const gridded = own.some((l) => new Set(l.feedNodes.map(mainRunAt)).size >= 2);
    return {
      id: root.handle,
      sourceNodeId: nodes[root.node]!.id,
      sharedSourceHandles: root.shared,
      nodeIds,
      pipeIds,
      headIds: headOrder.filter((h) => {
        const v = headNodeIndex.get(h);
        return v !== undefined && systemOf[v] === k;
      }),
      branchLineIds: own.map((l) => l.line.id),
      topology: loops === 0 ? 'tree' : gridded ? 'grid' : 'loop',
      loops,
    };
  });
  return {
    nodes,
    pipes,
    branchLines,
    headNode,
    systems,
    unattachedSourceHandles: sources.filter((s) => s.node < 0).map((s) => s.handle),
    unattachedHeadIds,
    disconnected: disconnectedParts(nodes, pipes, g, systemOf),
  };
}

/** A branch line with the indices `classify` goes on with: its first pipe and the nodes where it meets a main. */
interface IndexedLine {
  line: BranchLine;
  firstPipe: number;
  feedNodes: number[];
}

/** One line a run with branch pipes, in the order of the runs' first heads in the drawing. */
function buildBranchLines(
  nodes: NetNode[],
  pipes: NetPipe[],
  g: Graph,
  byRun: Grouped,
  branchRuns: number[],
  runHeads: number[][],
  headOrder: string[],
  onMain: (node: number) => boolean,
): IndexedLine[] {
  const rank = new Map(headOrder.map((h, i) => [h, i]));
  const firstRank = new Map(branchRuns.map((run) => [run, minOf(runHeads[run]!.map((v) => rank.get(nodes[v]!.headId!)!))]));
  const runs = [...branchRuns].sort((a, b) => firstRank.get(a)! - firstRank.get(b)!);
  const lines: IndexedLine[] = [];
  /** The line a node was last seen on, to take each node of a line once. */
  const lineOf = new Int32Array(nodes.length).fill(-1);
  for (const run of runs) {
    // The run's branch pipes in drawing order.
    const own: number[] = [];
    for (let i = byRun.start[run]!; i < byRun.start[run + 1]!; i++)
      if (pipes[byRun.members[i]!]!.role === 'branch') own.push(byRun.members[i]!);
    if (own.length === 0) continue;
    const feedNodes: number[] = [];
    for (const k of own) {
      for (const v of [g.from[k]!, g.to[k]!]) {
        if (lineOf[v] === lines.length) continue;
        lineOf[v] = lines.length;
        if (onMain(v)) feedNodes.push(v);
      }
    }
    const far = farthestPair(own.map((k) => pipes[k]!.points));
    const direction = unit(sub(far[1], far[0]));
    const origin = feedNodes.length ? nodes[feedNodes[0]!]!.position : far[0];
    const heads = runHeads[run]!;
    const reach = heads.map((v) => distance(nodes[v]!.position, origin));
    const headIds = heads
      .map((_, i) => i)
      .sort((a, b) => reach[a]! - reach[b]!)
      .map((i) => nodes[heads[i]!]!.headId!);
    lines.push({
      line: {
        id: `B${lines.length + 1}`,
        pipeIds: own.map((k) => pipes[k]!.id),
        headIds,
        direction,
        feedNodeIds: feedNodes.map((v) => nodes[v]!.id),
      },
      firstPipe: own[0]!,
      feedNodes,
    });
  }
  return lines;
}

/** The two farthest-apart points of a run's pipes (two sweeps: exact for the points of a straight line). */
function farthestPair(pipes: Point[][]): [Point, Point] {
  const farthestFrom = (a: Point) => {
    let b = a;
    for (const pts of pipes) for (const p of pts) if (distance(a, p) > distance(a, b)) b = p;
    return b;
  };
  const b = farthestFrom(pipes[0]![0]!);
  return [b, farthestFrom(b)];
}

/** The piping no source reaches, in connected parts. */
function disconnectedParts(nodes: NetNode[], pipes: NetPipe[], g: Graph, systemOf: Int32Array): DisconnectedPart[] {
  const seen = Uint8Array.from(systemOf, (k) => (k >= 0 ? 1 : 0));
  const parts: DisconnectedPart[] = [];
  for (let first = 0; first < nodes.length; first++) {
    if (seen[first]) continue;
    const stack = [first];
    seen[first] = 1;
    const partNodes: number[] = [];
    const partPipes = new Set<number>();
    while (stack.length) {
      const v = stack.pop()!;
      partNodes.push(v);
      for (let j = g.start[v]!; j < g.start[v + 1]!; j++) {
        partPipes.add(g.incident[j]!);
        const w = otherEnd(g, g.incident[j]!, v);
        if (!seen[w]) {
          seen[w] = 1;
          stack.push(w);
        }
      }
    }
    const list = [...partPipes].map((k) => pipes[k]!);
    parts.push({
      pipeIds: list.map((p) => p.id),
      headIds: partNodes.flatMap((v) => (nodes[v]!.headId ? [nodes[v]!.headId!] : [])),
      handles: [...new Set(list.flatMap((p) => p.handles))],
      at: list[0]?.points[0] ?? nodes[partNodes[0]!]!.position,
    });
  }
  return parts;
}
