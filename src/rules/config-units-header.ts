// Rule config-units-header: the drawing unit the config (or --drawing-units) states differs from the one the
// drawing's header states; the config wins, but every length then scales by their ratio, so it is said.

import { finding, type Rule } from './types.js';

export const configUnitsHeader: Rule<'config-units-header'> = {
  meta: {
    id: 'config-units-header',
    title: "Config unit contradicts the drawing's header",
    severity: 'warning',
    reference: 'DXF reference, HEADER section: $INSUNITS is the drawing unit (from memory); common practice to trust the drawing',
  },
  check({ drawing, plan }) {
    if (drawing.unitsFrom !== 'config' || drawing.headerUnits === null || drawing.headerUnits === drawing.units) return [];
    return [
      finding(this.meta, {
        params: { config: drawing.units, header: drawing.headerUnits },
        handles: [],
        at: plan.heads[0]?.position ?? { x: 0, y: 0 },
      }),
    ];
  },
};
