// Rule head-outside-room: where room outlines are drawn, a head outside all of them cannot be checked against its
// walls (warning); with no outlines at all, says once that wall checks used wall linework only, or nothing.

import { finding, type Rule } from './types.js';

export const headOutsideRoom: Rule<'head-outside-room'> = {
  meta: { id: 'head-outside-room', title: 'Head outside every room outline', severity: 'warning', reference: 'common practice, no source' },
  check({ plan, walls }) {
    if (plan.rooms.length === 0) {
      if (plan.heads.length === 0) return [];
      return [
        finding(this.meta, {
          severity: 'info',
          params: { kind: 'no-rooms', walls: walls.count > 0 },
          handles: [],
          at: plan.heads[0]!.position,
        }),
      ];
    }
    return plan.heads
      .filter((h) => walls.roomOf(h.position) === null)
      .map((h) => finding(this.meta, { params: { kind: 'head', head: h.id }, handles: [h.handle], at: h.position }));
  },
};
