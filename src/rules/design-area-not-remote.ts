// Rule design-area-not-remote: the drawn design area must be where the system is hydraulically most demanding;
// where the search finds a more demanding area, the difference at the source is reported.

import { finding, type Rule } from './types.js';

/** Differences below this at the source are taken as equal (common practice, no source). */
const PRESSURE_TOLERANCE_PSI = 0.5;

export const designAreaNotRemote: Rule<'design-area-not-remote'> = {
  meta: {
    id: 'design-area-not-remote',
    title: 'Drawn design area is not the most demanding',
    severity: 'error',
    reference: 'NFPA 13 (2019 edition), 28.2.4.1: the hydraulically most demanding design area (from memory)',
  },
  check({ design, settings }) {
    return design.areas
      .filter((a) => a.source === 'drawn' && a.hydraulics)
      .flatMap((a) => {
        // Compared with the most demanding area of its own system and zone.
        const best = design.areas.find((b) => b.rank === 'most-demanding' && b.system === a.system && b.zone === a.zone);
        if (!best?.hydraulics) return [];
        const bh = best.hydraulics;
        const h = a.hydraulics!;
        const worse = settings.supply
          ? h.margin! - bh.margin! > PRESSURE_TOLERANCE_PSI
          : bh.sourcePressure - h.sourcePressure > PRESSURE_TOLERANCE_PSI;
        if (!worse) return [];
        return [
          finding(this.meta, {
            params: {
              heads: best.headIds,
              bestPressure: bh.sourcePressure,
              bestFlow: bh.sourceFlow,
              drawnPressure: h.sourcePressure,
              drawnFlow: h.sourceFlow,
              place: best.place,
            },
            handles: a.handle ? [a.handle] : [],
            at: best.at,
            measured: h.sourcePressure,
            limit: bh.sourcePressure,
            quantity: 'pressure',
          }),
        ];
      });
  },
};
