// Rule network-topology: says whether the piping is a tree, a loop or a grid, so the reviewer knows
// how the hydraulic calculation treats it (information only).

import { finding, type Rule } from './types.js';

export const networkTopology: Rule = {
  meta: { id: 'network-topology', title: 'Network form', severity: 'info', reference: 'common practice, no source' },
  check({ network, plan }) {
    if (!network.sourceNodeId) return [];
    const source = network.nodes.find((n) => n.id === network.sourceNodeId)!;
    const text = network.topology === 'tree' ? 'a tree (one path from the source to each head)'
      : network.topology === 'grid' ? `a grid (branch lines fed from both ends; ${network.loops} loop(s))`
        : `looped (${network.loops} loop(s))`;
    return [finding(this.meta, {
      message: `the piping is ${text}: ${network.branchLines.length} branch line(s), ${network.pipes.length} pipe(s)`,
      handles: plan.sources.slice(0, 1).map((s) => s.handle), at: source.position, measured: network.loops, quantity: 'count',
    })];
  },
};
