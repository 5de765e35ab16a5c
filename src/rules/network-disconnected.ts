// Rule network-disconnected: piping not connected to the water source. With heads on it, those heads cannot be
// fed (error); bare pipe is a warning, often a crossing drawn over another pipe.

import { finding, type Rule } from './types.js';

export const networkDisconnected: Rule<'network-disconnected'> = {
  meta: {
    id: 'network-disconnected',
    title: 'Piping not connected to the source',
    severity: 'warning',
    reference: 'common practice, no source: every head must have a path to the water source',
  },
  check({ network }) {
    if (network.systems.length === 0) return [];
    return network.disconnected.map((part) =>
      finding(this.meta, {
        severity: part.headIds.length ? 'error' : 'warning',
        params: { pipes: part.pipeIds.length, heads: part.headIds },
        handles: part.handles,
        at: part.at,
        measured: part.headIds.length,
        quantity: 'count',
      }),
    );
  },
};
