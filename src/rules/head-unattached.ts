// Rule head-unattached: a head that sits on no pipe cannot be fed, so it is an error on the drawing. A head
// attaches on a pipe vertex, on a pipe's interior, or at the end of a drawn drop within the attach tolerance.

import { finding, type Rule } from './types.js';

export const headUnattached: Rule<'head-unattached'> = {
  meta: {
    id: 'head-unattached',
    title: 'Head on no pipe',
    severity: 'error',
    reference: 'common practice, no source: every head must be piped to be fed',
  },
  check({ plan, network, settings }) {
    const byId = new Map(plan.heads.map((h) => [h.id, h]));
    return network.unattachedHeadIds.map((id) => {
      const h = byId.get(id)!;
      return finding(this.meta, { params: { head: id, reach: settings.tolerances.headAttach }, handles: [h.handle], at: h.position });
    });
  },
};
