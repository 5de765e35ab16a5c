// config-units-mixed: values inside the config's hard ranges but far from what designs use in its unit system,
// and usual in the other (1 bar = 14.504 psi, 1 m² = 10.764 ft², 1 gpm/ft² = 40.746 mm/min: NIST SP 811).

import { describe, expect, it } from 'vitest';
import { checkLayout, findingsOf } from '../../test/support/check.js';

const layout = { s: 12, l: 10, heads: 3, lines: 2 };
const mixed = (config: Record<string, unknown>) => findingsOf(checkLayout(layout, config), 'config-units-mixed');

describe('config-units-mixed', () => {
  const valid: Record<string, unknown>[] = [
    { design: { density: 0.2, area: 1500 }, supply: { static: 80, residual: 60, flow: 1000 } },
    { unitSystem: 'si', design: { density: 8.1, area: 139 }, supply: { static: 5.5, residual: 4.1, flow: 3800 } },
    { design: { minHeadPressure: 15 } },
  ];
  it.each(valid)('usual values: %j', (config) => expect(mixed(config)).toEqual([]));

  const invalid: [Record<string, unknown>, string, RegExp][] = [
    // 5 psi is no city main; 5 bar = 72.5 psi is one.
    [{ supply: { static: 5, residual: 4, flow: 1000 } }, 'supply.static', /"supply\.static" 5 psi is unusual for a design, 5 bar is not: is "unitSystem": "si" meant/],
    // 139 ft² is under any design area; 139 m² = 1496 ft² is the usual 1500 ft².
    [{ design: { area: 139, density: 0.2 } }, 'design.area', /"design\.area" 139 ft² is unusual for a design, 139 m² is not/],
    // 1500 m² = 16,146 ft², past twice the curves' end; 1500 ft² is usual.
    [{ unitSystem: 'si', design: { area: 1500 } }, 'design.area', /"design\.area" 1500 m² is unusual for a design, 1500 ft² is not: is "unitSystem": "us" meant/],
    // 7 bar = 101.5 psi at every head is no design minimum; 7 psi is the usual one (from memory).
    [{ unitSystem: 'si', design: { minHeadPressure: 7 } }, 'design.minHeadPressure', /"design\.minHeadPressure" 7 bar is unusual for a design, 7 psi is not/],
  ];
  it.each(invalid)('%j: %s', (config, key, message) => {
    const f = mixed(config);
    expect(f.map((x) => x.message.slice(1, key.length + 1))).toContain(key);
    expect(f.find((x) => x.message.includes(key))!.message).toMatch(message);
    expect(f[0]!.severity).toBe('error');
  });
});
