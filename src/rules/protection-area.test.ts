// protection-area: S × L per head against 225 ft² light hazard, 130 ft² ordinary, 100 ft² extra (130 ft² below
// 0.25 gpm/ft²) — NFPA 13 (2019 edition), Table 10.2.4.2.1(a)-(c), confirmed; S × L by the standard's own method.

import { expect } from 'vitest';
import { ruleTester } from '../../test/support/rule-tester.js';
import { protectionArea } from './protection-area.js';

ruleTester(protectionArea, {
  valid: [
    { name: '12 × 10 = 120 ft² per head (ordinary hazard)', layout: { s: 12, l: 10, heads: 4, lines: 3 } },
    { name: 'ordinary hazard at the limit: 13 × 10 = 130 ft²', layout: { s: 13, l: 10, heads: 4, lines: 3 } },
    {
      name: 'light hazard at the limit: 15 × 15 = 225 ft²',
      layout: { s: 15, l: 15, heads: 3, lines: 3 },
      config: { design: { hazard: 'LH' } },
    },
    {
      name: 'extra hazard at the limit: 10 × 10 = 100 ft²',
      layout: { s: 10, l: 10, heads: 3, lines: 3 },
      config: { design: { hazard: 'EH1', density: 0.3 } },
    },
    {
      name: 'extra hazard below 0.25 gpm/ft²: 130 ft² applies (10 × 10.5 = 105)',
      layout: { s: 10, l: 10.5, heads: 3, lines: 3 },
      config: { design: { hazard: 'EH1', density: 0.2, area: 5000 } },
    },
    {
      name: 'sidewall heads follow their listing, not this table',
      layout: { s: 20, l: 20, heads: 2, lines: 2, headAttribs: [{ tag: 'TYPE', value: 'SW' }] },
    },
  ],
  invalid: [
    {
      name: '13.1 × 10 = 131 ft² over 130, every head',
      layout: { s: 13.1, l: 10, heads: 4, lines: 3 },
      count: 12,
      measured: 131,
      limit: 130,
      params: { s: 13.1, l: 10 },
    },
    {
      name: 'light hazard: 15 × 15.04 over 225 ft²',
      layout: { s: 15, l: 15.04, heads: 3, lines: 3 },
      config: { design: { hazard: 'LH' } },
      count: 9,
      limit: 225,
    },
    {
      name: 'extra hazard: 10 × 10.5 = 105 over 100 ft²',
      layout: { s: 10, l: 10.5, heads: 3, lines: 3 },
      config: { design: { hazard: 'EH1', density: 0.3 } },
      count: 9,
      measured: 105,
      limit: 100,
    },
    {
      name: 'a config limit overrides the table (an adopted edition): 120 over 110 ft²',
      layout: { s: 12, l: 10, heads: 3, lines: 3 },
      config: { limits: { maxArea: 110 } },
      count: 9,
      limit: 110,
      also: (f) => expect(f[0]!.reference).toMatch(/config override/),
    },
    {
      name: 'an end head counts twice its wall distance: 12 ft spacing, 7 ft to the wall, S = 14, 14 × 10 = 140 ft²',
      layout: { s: 12, l: 10, heads: 3, lines: 2, wallAlong: 7 },
      count: 4,
      measured: 140,
      params: { s: 14, l: 10 },
    },
  ],
});
