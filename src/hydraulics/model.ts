// The hydraulic model of one design area: the rebuilt network pruned to what carries flow, each pipe with
// its equivalent length (fittings inferred from the topology), flowing heads as K-factor emitters.

import type { Settings } from '../config/settings.js';
import type { Network } from '../network/types.js';
import type { Head } from '../read/plan.js';
import { EQUIVALENT_LENGTH_FT, fittingFactor } from './fittings.js';
import { resistance } from './hazen-williams.js';

export interface ModelNode { id: string; elevation: number }
export interface ModelPipe {
  id: string;
  from: number;
  to: number;
  /** Plan length plus fittings, ft. */
  length: number;
  fittingsLength: number;
  fittings: string[];
  diameter: number;
  c: number;
  r: number;
}
export interface Emitter { node: number; headId: string; k: number; required: number }

export interface HydraulicModel {
  nodes: ModelNode[];
  pipes: ModelPipe[];
  emitters: Emitter[];
  source: number;
  /** How the rise from the supply to the piping was modelled. */
  riser: { modelled: 'virtual' | 'none'; length: number; nominalSize: string };
}

export interface FlowingHead { head: Head; required: number }

/** Id of the virtual supply node and riser pipe when the supply is below the piping. */
export const SUPPLY_NODE_ID = 'SUPPLY';
export const RISER_PIPE_ID = 'RISER';

export function buildModel(network: Network, flowing: FlowingHead[], settings: Settings): HydraulicModel {
  if (!network.sourceNodeId) throw new Error('the network has no source');
  const pipeLevel = settings.defaults.headElevation;
  const headOfNode = new Map<string, Head>();
  const flowingByNode = new Map<string, FlowingHead>();
  for (const f of flowing) {
    const n = network.headNode[f.head.id];
    if (n) { flowingByNode.set(n, f); headOfNode.set(n, f.head); }
  }
  const keep = pruneDeadEnds(network, new Set(flowingByNode.keys()));
  const nodeIds = network.nodes.filter((n) => keep.nodes.has(n.id)).map((n) => n.id);
  const index = new Map(nodeIds.map((id, i) => [id, i]));
  const nodes: ModelNode[] = nodeIds.map((id) => ({ id, elevation: headOfNode.get(id)?.elevation ?? pipeLevel }));
  const fittings = settings.design.fittings ? inferFittings(network) : new Map<string, string[]>();
  const pipes: ModelPipe[] = network.pipes.filter((p) => keep.pipes.has(p.id)).map((p) => {
    const list = fittings.get(p.id) ?? [];
    const eq = EQUIVALENT_LENGTH_FT[p.nominalSize];
    const factor = fittingFactor(p.cFactor, p.nominalSize, p.innerDiameter);
    const fittingsLength = list.reduce((s, f) => s + (f === 'tee' ? eq.teeTurn : eq.elbow90), 0) * factor;
    const length = p.length + fittingsLength;
    return {
      id: p.id, from: index.get(p.from)!, to: index.get(p.to)!, length, fittingsLength, fittings: list,
      diameter: p.innerDiameter, c: p.cFactor, r: resistance(length, p.cFactor, p.innerDiameter),
    };
  });
  // Heads on piping that does not reach the source cannot flow: they are no emitters of this model.
  const emitters: Emitter[] = [...flowingByNode.entries()].filter(([nodeId]) => index.has(nodeId)).map(([nodeId, f]) => ({
    node: index.get(nodeId)!, headId: f.head.id, k: f.head.kFactor, required: f.required,
  }));
  let source = index.get(network.sourceNodeId)!;
  const rise = pipeLevel - settings.defaults.sourceElevation;
  const feed = network.pipes.find((p) => p.from === network.sourceNodeId || p.to === network.sourceNodeId);
  let riser: HydraulicModel['riser'] = { modelled: 'none', length: 0, nominalSize: feed?.nominalSize ?? settings.defaults.pipeSize };
  if (Math.abs(rise) > 1e-9 && feed) {
    nodes.push({ id: SUPPLY_NODE_ID, elevation: settings.defaults.sourceElevation });
    const length = Math.abs(rise);
    pipes.push({
      id: RISER_PIPE_ID, from: nodes.length - 1, to: source, length, fittingsLength: 0, fittings: [],
      diameter: feed.innerDiameter, c: feed.cFactor, r: resistance(length, feed.cFactor, feed.innerDiameter),
    });
    source = nodes.length - 1;
    riser = { modelled: 'virtual', length, nominalSize: feed.nominalSize };
  }
  return { nodes, pipes, emitters, source, riser };
}

/** Removes, repeatedly, end nodes that neither flow nor feed: their pipes carry no water. */
function pruneDeadEnds(network: Network, flowingNodes: Set<string>): { nodes: Set<string>; pipes: Set<string> } {
  const degree = new Map<string, number>(network.nodes.map((n) => [n.id, 0]));
  const incident = new Map<string, string[]>(network.nodes.map((n) => [n.id, []]));
  const pipeById = new Map(network.pipes.map((p) => [p.id, p]));
  for (const p of network.pipes) {
    degree.set(p.from, degree.get(p.from)! + 1);
    degree.set(p.to, degree.get(p.to)! + 1);
    incident.get(p.from)!.push(p.id);
    incident.get(p.to)!.push(p.id);
  }
  const nodes = new Set(network.nodes.map((n) => n.id));
  const pipes = new Set(network.pipes.map((p) => p.id));
  const removable = (id: string) => nodes.has(id) && degree.get(id)! <= 1 && id !== network.sourceNodeId && !flowingNodes.has(id);
  const queue = network.nodes.map((n) => n.id).filter(removable);
  while (queue.length) {
    const id = queue.pop()!;
    if (!removable(id)) continue;
    nodes.delete(id);
    for (const pid of incident.get(id)!) {
      if (!pipes.has(pid)) continue;
      pipes.delete(pid);
      const p = pipeById.get(pid)!;
      const other = p.from === id ? p.to : p.from;
      degree.set(other, degree.get(other)! - 1);
      if (removable(other)) queue.push(other);
    }
  }
  // Keep only what is connected to the source.
  const reached = new Set<string>();
  const stack = network.sourceNodeId && nodes.has(network.sourceNodeId) ? [network.sourceNodeId] : [];
  while (stack.length) {
    const id = stack.pop()!;
    if (reached.has(id)) continue;
    reached.add(id);
    for (const pid of incident.get(id)!) {
      if (!pipes.has(pid)) continue;
      const p = pipeById.get(pid)!;
      stack.push(p.from === id ? p.to : p.from);
    }
  }
  return { nodes: reached, pipes: new Set([...pipes].filter((pid) => reached.has(pipeById.get(pid)!.from))) };
}

/**
 * Fittings from the topology (common practice, no source): an elbow for each bend along a pipe, and a tee
 * where the flow turns into a pipe, i.e. where the pipe leaves a junction on a different run from the pipe
 * that feeds the junction (flow straight through a tee is not charged). Feeding direction: breadth-first
 * from the source.
 */
function inferFittings(network: Network): Map<string, string[]> {
  const incident = new Map<string, typeof network.pipes>(network.nodes.map((n) => [n.id, []]));
  for (const p of network.pipes) { incident.get(p.from)!.push(p); incident.get(p.to)!.push(p); }
  const out = new Map<string, string[]>();
  for (const p of network.pipes) out.set(p.id, Array.from({ length: p.bends }, () => 'elbow'));
  if (!network.sourceNodeId) return out;
  const feeder = new Map<string, (typeof network.pipes)[number]>();
  const seen = new Set([network.sourceNodeId]);
  const queue = [network.sourceNodeId];
  for (let i = 0; i < queue.length; i++) {
    const u = queue[i]!;
    for (const p of incident.get(u)!) {
      const v = p.from === u ? p.to : p.from;
      if (seen.has(v)) continue;
      seen.add(v);
      queue.push(v);
      feeder.set(v, p);
      const upstream = feeder.get(u);
      if (upstream && incident.get(u)!.length >= 3 && upstream.run !== p.run) out.get(p.id)!.push('tee');
    }
  }
  return out;
}
