// Rule design-area-missing: says when no design area is drawn (so only the searched one is reported), or when the
// hydraulic calculation could not be made, and why (information; a warning in `drawn` mode).

import { finding, type Rule } from './types.js';

export const designAreaMissing: Rule<'design-area-missing'> = {
  meta: {
    id: 'design-area-missing',
    title: 'Design area not drawn or not calculated',
    severity: 'info',
    reference: 'common practice, no source',
  },
  check({ design, settings, plan }) {
    const at = plan.heads[0]?.position ?? { x: 0, y: 0 };
    const out = design.notes.map((note) => finding(this.meta, { severity: 'warning', params: { kind: 'note', note }, handles: [], at }));
    if (design.drawnCount === 0 && settings.design.areaMode !== 'search') {
      out.push(
        finding(this.meta, {
          severity: settings.design.areaMode === 'drawn' ? 'warning' : 'info',
          params: { kind: 'not-drawn' },
          handles: [],
          at,
        }),
      );
    }
    for (const a of design.areas.filter((x) => !x.hydraulics)) {
      out.push(
        finding(this.meta, {
          severity: 'warning',
          params: { kind: 'not-calculated', source: a.source, note: a.note ?? '' },
          handles: a.handle ? [a.handle] : [],
          at: a.at,
        }),
      );
    }
    return out;
  },
};
