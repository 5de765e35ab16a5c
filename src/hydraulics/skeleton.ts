// The hydraulic model seen as anchors (the source and every node where pipes do not simply continue) joined
// by chains of pipes in series; a design area's solve works on this, with only its open heads added.

import { pipesAtNodes, type HydraulicModel, type PipesAtNodes } from './model.js';

/** A run of pipes in series from anchor `a` to anchor `b` (a = b for a loop on one anchor). */
export interface Chain {
  a: number;
  b: number;
  /** Interior model nodes in order from a to b; interior node i sits between pipes i and i + 1. */
  nodes: Int32Array;
  /** Model pipes in order from a to b (one more than the interior nodes). */
  pipes: Int32Array;
  /** +1 where the model pipe's from → to runs from a towards b, −1 where it runs back. */
  sign: Int8Array;
  /** cumR[j] = Σ r of pipes[0 .. j): the resistance between chain positions s < t is cumR[t] − cumR[s]. */
  cumR: Float64Array;
}

export interface Skeleton {
  /** Model node of each anchor, and the anchor of each model node (−1 for chain interiors). */
  anchorNode: Int32Array;
  anchorOf: Int32Array;
  chains: Chain[];
  /** Chains meeting at each anchor (a loop chain is listed once). */
  chainsAt: number[][];
  /** For a chain-interior model node: its chain and its index in the chain's interior; −1 for anchors. */
  chainOf: Int32Array;
  indexInChain: Int32Array;
  /** Anchor of the source. */
  source: number;
}

export function buildSkeleton(model: HydraulicModel): Skeleton {
  const n = model.nodes.length;
  const incident = pipesAtNodes(model);
  const anchorOf = new Int32Array(n).fill(-1);
  const anchorNode: number[] = [];
  const makeAnchor = (v: number) => {
    anchorOf[v] = anchorNode.length;
    anchorNode.push(v);
  };
  makeAnchor(model.source);
  for (let v = 0; v < n; v++) if (v !== model.source && incident[v]!.length !== 2) makeAnchor(v);
  const chainOf = new Int32Array(n).fill(-1);
  const indexInChain = new Int32Array(n).fill(-1);
  const used = new Uint8Array(model.pipes.length);
  const chains: Chain[] = [];
  const walk: ChainWalk = { model, incident, anchorOf, chainOf, indexInChain, used };
  for (let i = 0; i < anchorNode.length; i++) {
    for (const k of incident[anchorNode[i]!]!) if (!used[k]) chains.push(walkChain(walk, anchorNode[i]!, k, chains.length));
  }
  // A loop of plain pipes touching no anchor cannot be reached from the source: the model holds none.
  if (used.some((u) => !u)) throw new Error('the network has pipes not reachable from any junction');
  const chainsAt: number[][] = anchorNode.map(() => []);
  chains.forEach((c, i) => {
    chainsAt[c.a]!.push(i);
    if (c.b !== c.a) chainsAt[c.b]!.push(i);
  });
  return { anchorNode: Int32Array.from(anchorNode), anchorOf, chains, chainsAt, chainOf, indexInChain, source: 0 };
}

/** What walking a chain reads and marks: the model, each node's pipes, the anchors, and the marks it leaves. */
interface ChainWalk {
  model: HydraulicModel;
  incident: PipesAtNodes;
  anchorOf: Int32Array;
  chainOf: Int32Array;
  indexInChain: Int32Array;
  used: Uint8Array;
}

/** The chain that leaves anchor node `start` by pipe `first`, walked to the next anchor; its nodes are marked as chain `index`'s. */
function walkChain(w: ChainWalk, start: number, first: number, index: number): Chain {
  const nodes: number[] = [];
  const pipes: number[] = [];
  const sign: number[] = [];
  let at = start;
  let k = first;
  for (;;) {
    w.used[k] = 1;
    const p = w.model.pipes[k]!;
    const next = p.from === at ? p.to : p.from;
    pipes.push(k);
    sign.push(p.from === at ? 1 : -1);
    if (w.anchorOf[next]! >= 0) {
      at = next;
      break;
    }
    w.chainOf[next] = index;
    w.indexInChain[next] = nodes.length;
    nodes.push(next);
    const [k1, k2] = w.incident[next]!;
    k = k1 === k ? k2! : k1!;
    at = next;
  }
  const cumR = new Float64Array(pipes.length + 1);
  pipes.forEach((pk, j) => {
    cumR[j + 1] = cumR[j]! + w.model.pipes[pk]!.r;
  });
  return {
    a: w.anchorOf[start]!,
    b: w.anchorOf[at]!,
    nodes: Int32Array.from(nodes),
    pipes: Int32Array.from(pipes),
    sign: Int8Array.from(sign),
    cumR,
  };
}
