// Rule network-topology: says whether the piping is a tree, a loop or a grid, so the reviewer knows how the
// hydraulic calculation treats it (information only).

import { finding, type Rule } from './types.js';

export const networkTopology: Rule<'network-topology'> = {
  meta: { id: 'network-topology', title: 'Network form', severity: 'info', reference: 'common practice, no source' },
  check({ network, plan }) {
    if (!network.sourceNodeId) return [];
    const source = network.nodes.find((n) => n.id === network.sourceNodeId)!;
    return [
      finding(this.meta, {
        params: { topology: network.topology, loops: network.loops, lines: network.branchLines.length, pipes: network.pipes.length },
        handles: plan.sources.slice(0, 1).map((s) => s.handle),
        at: source.position,
        measured: network.loops,
        quantity: 'count',
      }),
    ];
  },
};
