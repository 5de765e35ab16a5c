// The hydraulic model of one design area: the rebuilt network pruned to what carries flow, each pipe with
// its equivalent length (fittings inferred from the topology), flowing heads as K-factor emitters.

import type { Settings } from '../config/settings.js';
import type { Network } from '../network/types.js';
import type { NominalSize } from '../quantities/pipe-sizes.js';
import type { Head } from '../read/plan.js';
import { EQUIVALENT_LENGTH_FT, fittingFactor } from './fittings.js';
import { resistance } from './hazen-williams.js';
import { incidence } from '../network/incidence.js';

export interface ModelNode {
  id: string;
  elevation: number;
}
export interface ModelPipe {
  id: string;
  from: number;
  to: number;
  /** Plan length plus fittings, ft. */
  length: number;
  fittingsLength: number;
  fittings: string[];
  nominalSize: NominalSize;
  diameter: number;
  c: number;
  r: number;
  /** The straight run the pipe lies on (−1: the virtual riser); a pipe on another run than its feed leaves a tee from the side. */
  run: number;
}
export interface Emitter {
  node: number;
  headId: string;
  k: number;
  required: number;
}

export interface HydraulicModel {
  nodes: ModelNode[];
  pipes: ModelPipe[];
  emitters: Emitter[];
  source: number;
  /** How the rise from the supply to the piping was modelled. */
  riser: { modelled: 'virtual' | 'none'; length: number; nominalSize: string };
}

export interface FlowingHead {
  head: Head;
  required: number;
}

/** Id of the virtual supply node and riser pipe when the supply is below the piping. */
const SUPPLY_NODE_ID = 'SUPPLY';
const RISER_PIPE_ID = 'RISER';

/** The model of the system fed from node `sourceNodeId`, with the given heads able to flow. */
export function buildModel(network: Network, sourceNodeId: string, flowing: FlowingHead[], settings: Settings): HydraulicModel {
  const pipeLevel = settings.defaults.headElevation;
  const headOfNode = new Map<string, Head>();
  const flowingByNode = new Map<string, FlowingHead>();
  for (const f of flowing) {
    const n = network.headNode[f.head.id];
    if (n) {
      flowingByNode.set(n, f);
      headOfNode.set(n, f.head);
    }
  }
  const g = indexNetwork(network, sourceNodeId);
  const keep = pruneDeadEnds(network, g, new Set(flowingByNode.keys()));
  // Each kept network node's index in the model (−1: pruned), in the network's order.
  const modelIndex = new Int32Array(network.nodes.length).fill(-1);
  const nodes: ModelNode[] = [];
  network.nodes.forEach((n, v) => {
    if (!keep.nodes[v]) return;
    modelIndex[v] = nodes.length;
    nodes.push({ id: n.id, elevation: headOfNode.get(n.id)?.elevation ?? pipeLevel });
  });
  const fittings = settings.design.fittings ? inferFittings(network, g) : null;
  const pipes: ModelPipe[] = network.pipes
    .flatMap((p, k) => (keep.pipes[k] ? [{ p, k }] : []))
    .map(({ p, k }) => {
      const list = fittings?.[k] ?? [];
      const eq = EQUIVALENT_LENGTH_FT[p.nominalSize];
      const factor = fittingFactor(p.cFactor, p.nominalSize, p.innerDiameter);
      const fittingsLength = list.reduce((s, f) => s + (f === 'tee' ? eq.teeTurn : eq.elbow90), 0) * factor;
      const length = p.length + fittingsLength;
      return {
        id: p.id,
        from: modelIndex[g.from[k]!]!,
        to: modelIndex[g.to[k]!]!,
        length,
        fittingsLength,
        fittings: list,
        nominalSize: p.nominalSize,
        diameter: p.innerDiameter,
        c: p.cFactor,
        r: resistance(length, p.cFactor, p.innerDiameter),
        run: p.run,
      };
    });
  // Heads on piping that does not reach the source cannot flow: they are no emitters of this model.
  const emitters: Emitter[] = [];
  for (const [nodeId, f] of flowingByNode) {
    const node = modelIndex[g.at.get(nodeId) ?? -1] ?? -1;
    if (node >= 0) emitters.push({ node, headId: f.head.id, k: f.head.kFactor, required: f.required });
  }
  const { source, riser } = addRiser(network, sourceNodeId, modelIndex[g.source]!, nodes, pipes, settings);
  return { nodes, pipes, emitters, source, riser };
}

/**
 * Where the supply is below (or above) the piping, the rise as a vertical pipe of the feed main's size from a
 * virtual supply node (added to `nodes` and `pipes`), which then is the source; else the source as it is.
 */
function addRiser(
  network: Network,
  sourceNodeId: string,
  sourceIndex: number,
  nodes: ModelNode[],
  pipes: ModelPipe[],
  settings: Settings,
): { source: number; riser: HydraulicModel['riser'] } {
  const rise = settings.defaults.headElevation - settings.defaults.sourceElevation;
  const feed = network.pipes.find((p) => p.from === sourceNodeId || p.to === sourceNodeId);
  if (Math.abs(rise) <= 1e-9 || !feed) {
    return { source: sourceIndex, riser: { modelled: 'none', length: 0, nominalSize: feed?.nominalSize ?? settings.defaults.pipeSize } };
  }
  nodes.push({ id: SUPPLY_NODE_ID, elevation: settings.defaults.sourceElevation });
  const length = Math.abs(rise);
  pipes.push({
    id: RISER_PIPE_ID,
    from: nodes.length - 1,
    to: sourceIndex,
    length,
    fittingsLength: 0,
    fittings: [],
    nominalSize: feed.nominalSize,
    diameter: feed.innerDiameter,
    c: feed.cFactor,
    r: resistance(length, feed.cFactor, feed.innerDiameter),
    run: -1,
  });
  return { source: nodes.length - 1, riser: { modelled: 'virtual', length, nominalSize: feed.nominalSize } };
}

/** The pipes at each node of a model, by index. */
export type PipesAtNodes = readonly (readonly number[])[];

/** Each model's pipes at its nodes, made once: the skeleton, the tree walk and the tables all ask for them. */
const pipesAtOf = new WeakMap<object, PipesAtNodes>();

/** The pipes at each node of a model (one list per model, shared). */
export function pipesAtNodes(model: Pick<HydraulicModel, 'nodes' | 'pipes'>): PipesAtNodes {
  const known = pipesAtOf.get(model);
  if (known) return known;
  // Lists of exact length (a list grown by push keeps room for 17 pipes: 20,000 nodes would take 4 MB, not 1).
  const { start, incident } = incidence(
    model.nodes.length,
    Int32Array.from(model.pipes, (p) => p.from),
    Int32Array.from(model.pipes, (p) => p.to),
  );
  const at = Array.from(model.nodes, (_, v) => Array.from(incident.subarray(start[v]!, start[v + 1]!)));
  pipesAtOf.set(model, at);
  return at;
}

/** The network's nodes and pipes by index: each node's index by id, each pipe's ends, and the pipes at each node. */
interface Indexed {
  at: Map<string, number>;
  from: Int32Array;
  to: Int32Array;
  start: Int32Array;
  incident: Int32Array;
  source: number;
}

function indexNetwork(network: Network, sourceNodeId: string): Indexed {
  const at = new Map(network.nodes.map((n, i) => [n.id, i]));
  const from = Int32Array.from(network.pipes, (p) => at.get(p.from)!);
  const to = Int32Array.from(network.pipes, (p) => at.get(p.to)!);
  const { start, incident } = incidence(network.nodes.length, from, to);
  return { at, from, to, start, incident, source: at.get(sourceNodeId) ?? -1 };
}

/** Removes, repeatedly, end nodes that neither flow nor feed (their pipes carry no water), and what does not reach the source. */
function pruneDeadEnds(network: Network, g: Indexed, flowingNodes: Set<string>): { nodes: Uint8Array; pipes: Uint8Array } {
  const n = network.nodes.length;
  const flowing = Uint8Array.from(network.nodes, (node) => (flowingNodes.has(node.id) ? 1 : 0));
  const degree = Int32Array.from({ length: n }, (_, v) => g.start[v + 1]! - g.start[v]!);
  const nodeOn = new Uint8Array(n).fill(1);
  const pipeOn = new Uint8Array(g.from.length).fill(1);
  const removable = (v: number) => nodeOn[v] === 1 && degree[v]! <= 1 && v !== g.source && !flowing[v];
  const queue: number[] = [];
  for (let v = 0; v < n; v++) if (removable(v)) queue.push(v);
  while (queue.length) {
    const v = queue.pop()!;
    if (!removable(v)) continue;
    nodeOn[v] = 0;
    for (let i = g.start[v]!; i < g.start[v + 1]!; i++) {
      const k = g.incident[i]!;
      if (!pipeOn[k]) continue;
      pipeOn[k] = 0;
      const other = g.from[k] === v ? g.to[k]! : g.from[k]!;
      degree[other]!--;
      if (removable(other)) queue.push(other);
    }
  }
  // Keep only what is connected to the source.
  const reached = new Uint8Array(n);
  const stack = g.source >= 0 && nodeOn[g.source] ? [g.source] : [];
  while (stack.length) {
    const v = stack.pop()!;
    if (reached[v]) continue;
    reached[v] = 1;
    for (let i = g.start[v]!; i < g.start[v + 1]!; i++) {
      const k = g.incident[i]!;
      if (pipeOn[k]) stack.push(g.from[k] === v ? g.to[k]! : g.from[k]!);
    }
  }
  for (let k = 0; k < pipeOn.length; k++) if (!reached[g.from[k]!]) pipeOn[k] = 0;
  return { nodes: reached, pipes: pipeOn };
}

/**
 * Fittings from the topology (common practice, no source): an elbow for each bend along a pipe, and a tee
 * where the flow turns into a pipe, i.e. where the pipe leaves a junction on a different run from the pipe
 * that feeds the junction (flow straight through a tee is not charged). Feeding direction: breadth-first
 * from the source. By pipe index.
 */
function inferFittings(network: Network, g: Indexed): (string[] | undefined)[] {
  // A list only for pipes with a fitting: most have none, and the network's pipes outnumber the model's.
  const out: (string[] | undefined)[] = network.pipes.map((p) =>
    p.bends > 0 ? Array.from({ length: p.bends }, () => 'elbow') : undefined,
  );
  if (g.source < 0) return out;
  const feeder = new Int32Array(network.nodes.length).fill(-1);
  const seen = new Uint8Array(network.nodes.length);
  seen[g.source] = 1;
  const queue = [g.source];
  for (let i = 0; i < queue.length; i++) {
    const u = queue[i]!;
    const junction = g.start[u + 1]! - g.start[u]! >= 3;
    for (let j = g.start[u]!; j < g.start[u + 1]!; j++) {
      const k = g.incident[j]!;
      const v = g.from[k] === u ? g.to[k]! : g.from[k]!;
      if (seen[v]) continue;
      seen[v] = 1;
      queue.push(v);
      feeder[v] = k;
      const upstream = feeder[u]!;
      if (upstream >= 0 && junction && network.pipes[upstream]!.run !== network.pipes[k]!.run) (out[k] ??= []).push('tee');
    }
  }
  return out;
}
