// design-basis-below-curve: the configured density and area against the hazard's density/area curve. Curve
// points: OH2 0.20 gpm/ft² at 1500 ft² (start, confirmed by a secondary source), 0.15 at 4000 (end, from memory),
// so 0.17 at 3000 ft² on the straight line between (common practice check value); LH 0.10 at 1500 (confirmed).

import { describe, expect, it } from 'vitest';
import { checkLayout, findingsOf } from '../../test/support/check.js';

const layout = { s: 12, l: 10, heads: 4, lines: 3 };
const below = (design: Record<string, unknown>) => findingsOf(checkLayout(layout, { design }), 'design-basis-below-curve');

describe('design-basis-below-curve', () => {
  const valid: Record<string, unknown>[] = [
    { hazard: 'OH2', density: 0.2, area: 1500 },
    { hazard: 'OH2', density: 0.17, area: 3000 },
    { hazard: 'OH2', area: 3000 },
    { hazard: 'OH2' },
    { hazard: 'LH', density: 0.1, area: 1500 },
    { hazard: 'OH2', density: 0.15, area: 6000 },
  ];
  it.each(valid)('on or above the curve: %j', (design) => expect(below(design)).toEqual([]));

  const invalid: [Record<string, unknown>, number, number, RegExp][] = [
    [{ hazard: 'OH2', density: 0.1, area: 1500 }, 0.1, 0.2, /0\.10 gpm\/ft² over 1500\.0 ft² is below the OH2 curve, which asks 0\.20 gpm\/ft² at 1500\.0 ft²/],
    [{ hazard: 'OH2', density: 0.16, area: 3000 }, 0.16, 0.17, /asks 0\.17 gpm\/ft² at 3000\.0 ft²/],
    [{ hazard: 'OH2', density: 0.14, area: 6000 }, 0.14, 0.15, /asks 0\.15 gpm\/ft² at 4000\.0 ft²/],
    [{ hazard: 'OH2', density: 0.2, area: 1000 }, 1000, 1500, /1000\.0 ft² is under the least area of the OH2 curve, 1500\.0 ft²/],
    [{ hazard: 'EH1', density: 0.25 }, 0.25, 0.3, /below the EH1 curve, which asks 0\.30 gpm\/ft² at 2500\.0 ft²/],
  ];
  it.each(invalid)('below the curve: %j', (design, measured, limit, message) => {
    const f = below(design);
    expect(f).toHaveLength(1);
    expect(f[0]!.severity).toBe('error');
    expect(f[0]!.measured).toBeCloseTo(measured, 9);
    expect(f[0]!.limit).toBeCloseTo(limit, 9);
    expect(f[0]!.message).toMatch(message);
    expect(f[0]!.reference).toMatch(/NFPA 13 \(2019 edition\), Figure 19\.3\.3\.1\.1/);
  });
});
