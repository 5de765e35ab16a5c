// supply-short: the flow test must cover the demand with hose streams (from memory: NFPA 13 (2019 edition),
// 28.2.1; the supply line P = Ps − (Ps − Pr)(Q/Qr)^1.85, NFPA 291 form, confirmed); a margin under 10 psi is a
// warning (common practice). 40 psi static, 30 at 100 gpm runs dry at 100·4^(1/1.85) = 211.6 gpm (Python's math).

import { expect } from 'vitest';
import { ruleTester } from '../../test/support/rule-tester.js';
import { supplyShort } from './supply-short.js';

const layout = { s: 12, l: 10, heads: 8, lines: 6 };
const design = { hazard: 'OH2', density: 0.2, area: 1500 };

ruleTester(supplyShort, {
  valid: [
    {
      name: 'an ample supply: 120 psi static, 100 at 1500 gpm',
      layout,
      config: { design, supply: { static: 120, residual: 100, flow: 1500 } },
    },
  ],
  invalid: [
    { name: 'no flow test: said, not checked', layout, config: { design }, count: 1, severity: 'info', params: { kind: 'no-supply' } },
    {
      name: 'a weak supply: both searched areas short',
      layout,
      config: { design, supply: { static: 40, residual: 30, flow: 500 } },
      count: 2,
      severity: 'error',
      also: (f) => {
        expect(f[0]!.params).toMatchObject({ kind: 'short', area: 'most-demanding' });
        expect((f[0]!.params as { demand: number; pressure: number }).demand).toBeGreaterThan(250);
      },
    },
    {
      name: 'a supply that runs dry before the demand gives 0 and says where it runs dry',
      layout,
      config: { design, supply: { static: 40, residual: 30, flow: 100 } },
      count: 2,
      also: (f) => {
        const p = f[0]!.params as { available: number; dryAt: number };
        expect(p.available).toBe(0);
        expect(p.dryAt).toBeCloseTo(100 * 4 ** (1 / 1.85), 6);
      },
    },
    // the area needs 90.7 psi at 610 gpm with hose; 100 psi static, 96 at 1000 gpm gives 98.4 psi there
    {
      name: 'a margin of a few psi: a warning',
      layout,
      config: { design, supply: { static: 100, residual: 96, flow: 1000 } },
      count: 2,
      severity: 'warning',
      params: { kind: 'low-margin' },
      limit: 10,
    },
  ],
});
