// config-units-header: a config "units" that contradicts $INSUNITS (1 = inches, 2 = feet; DXF reference, from
// memory) is said; the config still wins.

import { describe, expect, it } from 'vitest';
import { checkLayout, findingsOf } from '../../test/support/check.js';

const layout = { s: 12, l: 10, heads: 3, lines: 2 };

describe('config-units-header', () => {
  it.each([{}, { units: 'in' }])('no finding when the config agrees with the header or says nothing: %j', (config) => {
    expect(findingsOf(checkLayout(layout, config), 'config-units-header')).toEqual([]);
  });
  it('a config in feet on a drawing whose header says inches: a warning naming both, lengths read in feet', () => {
    const r = checkLayout(layout, { units: 'ft' });
    const f = findingsOf(r, 'config-units-header');
    expect(f).toHaveLength(1);
    expect(f[0]!.severity).toBe('warning');
    expect(f[0]!.message).toMatch(/config says the drawing is in ft but its header \(\$INSUNITS\) says in/);
    expect(r.report.input.drawingUnits).toBe('ft');
  });
});
