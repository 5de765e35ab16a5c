// Rule network-topology: says of each system whether its piping is a tree, a loop or a grid, so the reviewer
// knows how the hydraulic calculation treats it (information only).

import { finding, type Rule } from './types.js';

export const networkTopology: Rule<'network-topology'> = {
  meta: { id: 'network-topology', title: 'Network form', severity: 'info', reference: 'common practice, no source' },
  check({ network }) {
    const nodeById = new Map(network.nodes.map((n) => [n.id, n]));
    return network.systems.map((system) =>
      finding(this.meta, {
        params: {
          system: system.id,
          systems: network.systems.length,
          topology: system.topology,
          loops: system.loops,
          lines: system.branchLineIds.length,
          pipes: system.pipeIds.length,
        },
        handles: [system.id],
        at: nodeById.get(system.sourceNodeId)!.position,
        measured: system.loops,
        quantity: 'count',
      }),
    );
  },
};
