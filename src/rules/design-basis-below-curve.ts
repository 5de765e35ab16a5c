// Rule design-basis-below-curve: a configured density and area must lie on or above the hazard's density/area
// curve; a design below it (0.10 gpm/ft² over 1500 ft² for OH2) would pass a system that is too weak.

import { CURVES, CURVE_SOURCE, curveDensity, type DesignBasis } from '../basis/design-basis.js';
import { finding, type Rule } from './types.js';

/** Densities are compared to this many gpm/ft² (a rounding of the configured value is no finding). */
const DENSITY_TOLERANCE = 1e-6;

export const designBasisBelowCurve: Rule<'design-basis-below-curve'> = {
  meta: {
    id: 'design-basis-below-curve',
    title: "Design basis below the hazard's density/area curve",
    severity: 'error',
    reference: CURVE_SOURCE,
  },
  check({ zoning, settings, plan }) {
    const at = plan.heads[0]?.position ?? { x: 0, y: 0 };
    // The configured design, and each `zones` basis a zone took, where its density or area is given.
    const given: { zone: string | null; basis: DesignBasis }[] = [];
    if (settings.design.density !== undefined || settings.design.area !== undefined)
      given.push({ zone: null, basis: zoning.design.design });
    for (const z of zoning.zones) {
      const own = z.pattern === null ? undefined : settings.zones[z.pattern];
      if (!own || (own.density === undefined && own.area === undefined) || given.some((g) => g.zone === z.pattern)) continue;
      given.push({ zone: z.pattern, basis: z.design });
    }
    return given.flatMap(({ zone, basis }) => {
      const { hazard, density, baseArea } = basis;
      const [startArea, startDensity] = CURVES[hazard].start;
      const [endArea] = CURVES[hazard].end;
      if (baseArea < startArea - 1e-6) {
        return [
          finding(this.meta, {
            params: { zone, kind: 'area', hazard, area: baseArea, minArea: startArea, startDensity },
            handles: [],
            at,
            measured: baseArea,
            limit: startArea,
            quantity: 'area',
          }),
        ];
      }
      const onCurve = Math.min(baseArea, endArea);
      const need = curveDensity(hazard, onCurve)!;
      if (density >= need - DENSITY_TOLERANCE) return [];
      return [
        finding(this.meta, {
          params: { zone, kind: 'density', hazard, density, area: baseArea, need, atArea: onCurve },
          handles: [],
          at,
          measured: density,
          limit: need,
          quantity: 'density',
        }),
      ];
    });
  },
};
