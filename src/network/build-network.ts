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
  // Renumber the nodes that remain pipe ends.
  const keep = new Map<number, number>();
  const nodeOf = (raw: number) => {
    if (!keep.has(raw)) keep.set(raw, keep.size);
    return keep.get(raw)!;
  };
  for (const c of chains) {
    nodeOf(c.from);
    nodeOf(c.to);
  }
  const nodes: NetNode[] = [...keep.entries()].map(([raw, i]) => ({
    id: `N${i + 1}`,
    position: g.nodes[raw]!,
    isSource: isSourceRaw.has(raw),
    ...(headAt.has(raw) ? { headId: headAt.get(raw)! } : {}),
  }));
  const schedule = settings.defaults.schedule;
  const runs = groupRuns(
    nodes.length,
    chains.map((c) => ({ from: keep.get(c.from)!, to: keep.get(c.to)!, points: c.points, size: c.size ?? defaultSize })),
    (n) => nodes[n]!.headId !== undefined,
  );
  const pipes: NetPipe[] = chains.map((c, i) => {
    const size = c.size ?? defaultSize;
    return {
      id: `P${i + 1}`,
      from: nodes[keep.get(c.from)!]!.id,
      to: nodes[keep.get(c.to)!]!.id,
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
  const headNode: Record<string, string> = {};
  for (const [raw, headId] of headAt) headNode[headId] = nodes[keep.get(raw)!]!.id;
  plan.heads.forEach((h, i) => {
    const raw = g.attached[i]!;
    if (raw >= 0 && keep.has(raw) && !headNode[h.id]) headNode[h.id] = nodes[keep.get(raw)!]!.id;
  });
  const sources = plan.sources.map((s, i) => {
    const raw = sourceRaws[i]!;
    return { handle: s.handle, nodeId: raw >= 0 && keep.has(raw) ? nodes[keep.get(raw)!]!.id : null };
  });
  const unattachedHeadIds = plan.heads.filter((h) => !headNode[h.id]).map((h) => h.id);
  return classify(
    nodes,
    pipes,
    headNode,
    sources,
    unattachedHeadIds,
    plan.heads.map((h) => h.id),
  );
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

/** Roles, branch lines, topology and disconnected parts. */
function classify(
  nodes: NetNode[],
  pipes: NetPipe[],
  headNode: Record<string, string>,
  sources: { handle: string; nodeId: string | null }[],
  unattachedHeadIds: string[],
  headOrder: string[],
): Network {
  const nodeById = new Map(nodes.map((n) => [n.id, n]));
  const incident = new Map<string, NetPipe[]>(nodes.map((n) => [n.id, []]));
  for (const p of pipes) {
    incident.get(p.from)!.push(p);
    incident.get(p.to)!.push(p);
  }
  const degree = (id: string) => incident.get(id)!.length;
  const hasHead = (id: string) => nodeById.get(id)!.headId !== undefined;

  // Drops: a short pipe to a lone head, on a run of its own.
  const runPipes = new Map<number, NetPipe[]>();
  for (const p of pipes) {
    const list = runPipes.get(p.run);
    if (list) list.push(p);
    else runPipes.set(p.run, [p]);
  }
  const isDrop = (p: NetPipe) => {
    if (p.length > DROP_MAX_FT || runPipes.get(p.run)!.length !== 1) return false;
    const [leaf, root] = degree(p.to) === 1 && hasHead(p.to) ? [p.to, p.from] : [p.from, p.to];
    return degree(leaf) === 1 && hasHead(leaf) && degree(root) >= 2 && !hasHead(root);
  };
  for (const p of pipes) if (isDrop(p)) p.role = 'drop';

  // Heads of each run: on its nodes, or at the end of its drops.
  const runsAtNode = new Map<string, Set<number>>();
  for (const p of pipes) {
    if (p.role === 'drop') continue;
    for (const n of [p.from, p.to]) runsAtNode.set(n, (runsAtNode.get(n) ?? new Set()).add(p.run));
  }
  const runHeads = new Map<number, Set<string>>();
  const addHead = (run: number, head: string) => runHeads.set(run, (runHeads.get(run) ?? new Set()).add(head));
  for (const p of pipes) {
    if (p.role === 'drop') {
      const leaf = hasHead(p.to) && degree(p.to) === 1 ? p.to : p.from;
      const root = leaf === p.to ? p.from : p.to;
      for (const r of runsAtNode.get(root) ?? []) addHead(r, nodeById.get(leaf)!.headId!);
    } else {
      for (const n of [p.from, p.to]) if (hasHead(n)) addHead(p.run, nodeById.get(n)!.headId!);
    }
  }
  const branchRuns = new Set(runHeads.keys());

  // Reachability from each source, and heads carried downstream (over a breadth-first spanning forest, one
  // tree per system). A source on piping an earlier source already reached shares that system.
  const reached = new Set<string>();
  const order: string[] = [];
  const parentPipe = new Map<string, NetPipe>();
  const systemRoots: { handle: string; nodeId: string; shared: string[]; first: number }[] = [];
  const systemOfNode = new Map<string, number>();
  for (const s of sources) {
    if (s.nodeId === null) continue;
    if (reached.has(s.nodeId)) {
      systemRoots[systemOfNode.get(s.nodeId)!]!.shared.push(s.handle);
      continue;
    }
    const k = systemRoots.length;
    systemRoots.push({ handle: s.handle, nodeId: s.nodeId, shared: [], first: order.length });
    reached.add(s.nodeId);
    order.push(s.nodeId);
    systemOfNode.set(s.nodeId, k);
    for (let i = order.length - 1; i < order.length; i++) {
      for (const p of incident.get(order[i]!)!) {
        const other = p.from === order[i] ? p.to : p.from;
        if (!reached.has(other)) {
          reached.add(other);
          order.push(other);
          parentPipe.set(other, p);
          systemOfNode.set(other, k);
        }
      }
    }
  }
  const carried = new Map<string, number>();
  const below = new Map<string, number>(order.map((n) => [n, hasHead(n) ? 1 : 0]));
  for (let i = order.length - 1; i >= 0; i--) {
    const n = order[i]!;
    const p = parentPipe.get(n);
    if (!p) continue; // a system's source
    carried.set(p.id, below.get(n)!);
    const up = p.from === n ? p.to : p.from;
    below.set(up, below.get(up)! + below.get(n)!);
  }

  // Mains: runs without heads; a run touching two or more branch lines is a cross main.
  const runNodes = new Map<number, Set<string>>();
  for (const p of pipes)
    if (p.role !== 'drop') for (const n of [p.from, p.to]) runNodes.set(p.run, (runNodes.get(p.run) ?? new Set()).add(n));
  // Per run, once (a cross main of 2,500 pipes would otherwise walk its 2,500 nodes for each of them).
  const touchingCount = new Map<number, number>();
  const branchesTouching = (run: number) => {
    let count = touchingCount.get(run);
    if (count === undefined) {
      const touching = new Set<number>();
      for (const n of runNodes.get(run) ?? []) for (const r of runsAtNode.get(n) ?? []) if (r !== run && branchRuns.has(r)) touching.add(r);
      touchingCount.set(run, (count = touching.size));
    }
    return count;
  };
  for (const p of pipes) {
    if (p.role === 'drop') continue;
    if (branchRuns.has(p.run)) p.role = 'branch';
    else if (branchesTouching(p.run) >= 2) p.role = 'cross-main';
    else if (reached.has(p.from) && ((carried.get(p.id) ?? 0) > 0 || !parentPipeOf(parentPipe, p))) p.role = 'feed-main';
  }

  const branchLines = buildBranchLines(pipes, runHeads, nodeById, incident, headOrder, headNode);
  const headNodeIds = new Set(Object.values(headNode));
  const pipeById = new Map(pipes.map((p) => [p.id, p]));
  const systems = systemRoots.map((root, k): NetSystem => {
    const nodeIds = order.slice(root.first, systemRoots[k + 1]?.first ?? order.length);
    const own = new Set(nodeIds);
    const pipeIds = pipes.filter((p) => own.has(p.from)).map((p) => p.id);
    const lines = branchLines.filter((b) => own.has(pipeById.get(b.pipeIds[0]!)!.from));
    const loops = Math.max(0, pipeIds.length - nodeIds.length + 1);
    const gridded = lines.some((b) => new Set(b.feedNodeIds.map((n) => mainRunAt(n, incident))).size >= 2);
    return {
      id: root.handle,
      sourceNodeId: root.nodeId,
      sharedSourceHandles: root.shared,
      nodeIds,
      pipeIds,
      headIds: headOrder.filter((h) => headNode[h] !== undefined && own.has(headNode[h]!)),
      branchLineIds: lines.map((b) => b.id),
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
    unattachedSourceHandles: sources.filter((s) => s.nodeId === null).map((s) => s.handle),
    unattachedHeadIds,
    disconnected: disconnectedParts(nodes, reached, incident, headNodeIds),
  };
}

/** Whether the pipe is a tree edge (it carries flow to the part below it). */
function parentPipeOf(parentPipe: Map<string, NetPipe>, p: NetPipe): boolean {
  return parentPipe.get(p.to) === p || parentPipe.get(p.from) === p;
}

function mainRunAt(nodeId: string, incident: Map<string, NetPipe[]>): number | null {
  const main = incident.get(nodeId)!.find((p) => p.role === 'cross-main' || p.role === 'feed-main');
  return main ? main.run : null;
}

function buildBranchLines(
  pipes: NetPipe[],
  runHeads: Map<number, Set<string>>,
  nodeById: Map<string, NetNode>,
  incident: Map<string, NetPipe[]>,
  headOrder: string[],
  headNode: Record<string, string>,
): BranchLine[] {
  const rank = new Map(headOrder.map((h, i) => [h, i]));
  const lines: BranchLine[] = [];
  const firstRank = (run: number) => minOf([...runHeads.get(run)!].map((h) => rank.get(h)!));
  const runs = [...runHeads.keys()].sort((a, b) => firstRank(a) - firstRank(b));
  // Each run's branch pipes in drawing order, gathered in one pass.
  const branchPipesOf = new Map<number, NetPipe[]>();
  for (const p of pipes) {
    if (p.role !== 'branch') continue;
    const list = branchPipesOf.get(p.run);
    if (list) list.push(p);
    else branchPipesOf.set(p.run, [p]);
  }
  for (const run of runs) {
    const own = branchPipesOf.get(run) ?? [];
    if (own.length === 0) continue;
    const nodeIds = new Set(own.flatMap((p) => [p.from, p.to]));
    const feedNodeIds = [...nodeIds].filter((n) => incident.get(n)!.some((p) => p.role === 'cross-main' || p.role === 'feed-main'));
    const pts = own.flatMap((p) => p.points);
    const far = farthestPair(pts);
    const direction = unit(sub(far[1], far[0]));
    const origin = feedNodeIds.length ? nodeById.get(feedNodeIds[0]!)!.position : far[0];
    const headPos = (h: string) => nodeById.get(headNode[h]!)?.position ?? origin;
    const headIds = [...runHeads.get(run)!].sort((a, b) => distance(headPos(a), origin) - distance(headPos(b), origin));
    lines.push({ id: `B${lines.length + 1}`, pipeIds: own.map((p) => p.id), headIds, direction, feedNodeIds });
  }
  return lines;
}

/** The two farthest-apart points of a run (two sweeps: exact for the points of a straight line). */
function farthestPair(pts: Point[]): [Point, Point] {
  const farthestFrom = (a: Point) => pts.reduce((b, p) => (distance(a, p) > distance(a, b) ? p : b), a);
  const b = farthestFrom(pts[0]!);
  return [b, farthestFrom(b)];
}

function disconnectedParts(
  nodes: NetNode[],
  reached: Set<string>,
  incident: Map<string, NetPipe[]>,
  headNodeIds: Set<string>,
): DisconnectedPart[] {
  const byId = new Map(nodes.map((n) => [n.id, n]));
  const seen = new Set<string>(reached);
  const parts: DisconnectedPart[] = [];
  for (const start of nodes) {
    if (seen.has(start.id)) continue;
    const stack = [start.id];
    seen.add(start.id);
    const partNodes: NetNode[] = [];
    const partPipes = new Set<NetPipe>();
    while (stack.length) {
      const id = stack.pop()!;
      const node = byId.get(id)!;
      partNodes.push(node);
      for (const p of incident.get(id)!) {
        partPipes.add(p);
        const other = p.from === id ? p.to : p.from;
        if (!seen.has(other)) {
          seen.add(other);
          stack.push(other);
        }
      }
    }
    const list = [...partPipes];
    parts.push({
      pipeIds: list.map((p) => p.id),
      headIds: partNodes.filter((n) => headNodeIds.has(n.id) && n.headId).map((n) => n.headId!),
      handles: [...new Set(list.flatMap((p) => p.handles))],
      at: list[0]?.points[0] ?? partNodes[0]!.position,
    });
  }
  return parts;
}
