// Rule network-disconnected: piping not connected to the water source. With heads on it, those heads
// cannot be fed (error); bare pipe is a warning, often a crossing drawn over another pipe.

import { finding, type Rule } from './types.js';

export const networkDisconnected: Rule = {
  meta: {
    id: 'network-disconnected', title: 'Piping not connected to the source', severity: 'warning',
    reference: 'common practice, no source: every head must have a path to the water source',
  },
  check({ network }) {
    if (!network.sourceNodeId) return [];
    return network.disconnected.map((part) =>
      finding(this.meta, {
        severity: part.headIds.length ? 'error' : 'warning',
        message: part.headIds.length
          ? `${part.pipeIds.length} pipe(s) carrying ${part.headIds.length} head(s) (${part.headIds.join(', ')}) are not connected to the source`
          : `${part.pipeIds.length} pipe(s) are not connected to the source (a crossing without a joint?)`,
        handles: part.handles, at: part.at, measured: part.headIds.length, quantity: 'count',
      }),
    );
  },
};
