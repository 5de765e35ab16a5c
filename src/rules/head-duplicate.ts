// Rule head-duplicate: a head symbol drawn again at the point of another is one head drawn twice (a drafting slip);
// it is counted once everywhere, and the extra copies are listed for the drawing to be cleaned.

import { finding, type Rule } from './types.js';

export const headDuplicate: Rule<'head-duplicate'> = {
  meta: { id: 'head-duplicate', title: 'Head drawn twice at one point', severity: 'warning', reference: 'common practice, no source' },
  check({ plan }) {
    const byId = new Map(plan.heads.map((h) => [h.id, h]));
    return plan.duplicateHeads.map((d) => {
      const head = byId.get(d.headId)!;
      return finding(this.meta, {
        params: { head: head.id, drawn: d.handles.length + 1 },
        handles: [head.handle, ...d.handles],
        at: head.position,
        measured: d.handles.length + 1,
        limit: 1,
        quantity: 'count',
      });
    });
  },
};
