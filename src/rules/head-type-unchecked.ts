// Rule head-type-unchecked: sidewall, extended-coverage and other special heads have listed limits, not the
// standard-spray table, so their spacing is not checked here; the reviewer is told (info).

import { finding, type Rule } from './types.js';

export const headTypeUnchecked: Rule<'head-type-unchecked'> = {
  meta: {
    id: 'head-type-unchecked',
    title: 'Special head not checked against the standard-spray table',
    severity: 'info',
    reference: 'NFPA 13 (2019 edition), Chapters 11-12: listed heads follow their listing (from memory)',
  },
  check({ plan }) {
    return plan.heads.flatMap((h) =>
      h.kind === 'standard'
        ? []
        : [
            finding(this.meta, {
              params: { head: h.id, kind: h.kind, type: h.attributes['TYPE'] ?? h.attributes['HEADTYPE'] ?? '' },
              handles: [h.handle],
              at: h.position,
            }),
          ],
    );
  },
};
