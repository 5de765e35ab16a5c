// Rule head-unattached: a head on no pipe of a piped drawing cannot be fed (an error). A head attaches on a pipe
// vertex, on a pipe's interior, or at the end of a drawn drop within the attach tolerance.

import { finding, type Rule } from './types.js';

export const headUnattached: Rule<'head-unattached'> = {
  meta: {
    id: 'head-unattached',
    title: 'Head on no pipe',
    severity: 'error',
    reference: 'common practice, no source: every head must be piped to be fed',
  },
  check({ plan, network, settings }) {
    // A layout without any piping yet is no error of its heads (hydraulics-not-evaluated says so).
    if (network.pipes.length === 0) return [];
    const byId = new Map(plan.heads.map((h) => [h.id, h]));
    return network.unattachedHeadIds.map((id) => {
      const h = byId.get(id)!;
      return finding(this.meta, { params: { head: id, reach: settings.tolerances.headAttach }, handles: [h.handle], at: h.position });
    });
  },
};
