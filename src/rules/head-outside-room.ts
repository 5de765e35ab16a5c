// Rule head-outside-room: where room outlines are drawn, a head outside all of them cannot be checked
// against its walls (warning); with no outlines at all, says once that wall checks used wall linework only.

import { finding, type Rule } from './types.js';

export const headOutsideRoom: Rule = {
  meta: { id: 'head-outside-room', title: 'Head outside every room outline', severity: 'warning', reference: 'common practice, no source' },
  check({ plan, walls }) {
    if (plan.rooms.length === 0) {
      if (plan.heads.length === 0) return [];
      return [finding(this.meta, {
        severity: 'info', handles: [], at: plan.heads[0]!.position,
        message: walls.count ? 'no closed room outlines on the wall layers: wall distances measured to wall linework'
          : 'no walls found: wall-distance and coverage checks at the room edges were skipped',
      })];
    }
    return plan.heads
      .filter((h) => walls.roomOf(h.position) === null)
      .map((h) => finding(this.meta, { message: `head ${h.id} is outside every room outline`, handles: [h.handle], at: h.position }));
  },
};
