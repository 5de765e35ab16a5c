// head-type-unchecked: sidewall and extended-coverage heads follow their listing, not the standard-spray table
// (from memory: NFPA 13 (2019 edition), Chapters 11-12); they are named, never checked against it.

import { expect } from 'vitest';
import { checkLayout, findingsOf } from '../../test/support/check.js';
import { ruleTester } from '../../test/support/rule-tester.js';
import { headTypeUnchecked } from './head-type-unchecked.js';

const sidewalls = { s: 20, l: 20, heads: 2, lines: 2, headAttribs: [{ tag: 'TYPE', value: 'SW' }] };

ruleTester(headTypeUnchecked, {
  valid: [
    { name: 'standard-spray heads (no TYPE)', layout: { s: 12, l: 10, heads: 3, lines: 2 } },
    { name: 'a TYPE that says pendent', layout: { s: 12, l: 10, heads: 3, lines: 2, headAttribs: [{ tag: 'TYPE', value: 'PENDENT' }] } },
  ],
  invalid: [
    {
      name: 'sidewall heads 20 ft apart: named, not checked for spacing or area',
      layout: sidewalls,
      count: 4,
      severity: 'info',
      params: { kind: 'sidewall' },
      also: () => {
        const r = checkLayout(sidewalls);
        expect(findingsOf(r, 'protection-area')).toEqual([]);
        expect(findingsOf(r, 'head-spacing-max')).toEqual([]);
      },
    },
    {
      name: 'an unknown TYPE is quoted',
      layout: { s: 12, l: 10, heads: 3, lines: 1, headAttribs: [{ tag: 'TYPE', value: 'ESFR-25' }] },
      count: 3,
      params: { kind: 'other', type: 'ESFR-25' },
    },
  ],
});
