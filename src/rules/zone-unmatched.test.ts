// zone-unmatched: a hazard zone whose label no `zones` pattern matches takes the configured design, with a warning
// (common practice, no source).

import { ruleTester } from '../../test/support/rule-tester.js';
import { zoneUnmatched } from './zone-unmatched.js';

const layout = { s: 12, l: 10, heads: 4, lines: 3 };
/** The 48 × 30 ft room split in two zones at x = 24 ft. */
const halves = (left?: string, right?: string) => ({
  ...layout,
  zones: [
    {
      outline: [
        { x: 0, y: 0 },
        { x: 24, y: 0 },
        { x: 24, y: 30 },
        { x: 0, y: 30 },
      ],
      ...(left === undefined ? {} : { label: left }),
    },
    {
      outline: [
        { x: 24, y: 0 },
        { x: 48, y: 0 },
        { x: 48, y: 30 },
        { x: 24, y: 30 },
      ],
      ...(right === undefined ? {} : { label: right }),
    },
  ],
});
const zones = { 'OFFICE*': { hazard: 'LH' }, '*STORAGE*': { hazard: 'OH2' } };

ruleTester(zoneUnmatched, {
  valid: [
    { name: 'both labels match a pattern (case-insensitive)', layout: halves('Office 101', 'BULK STORAGE'), config: { zones } },
    { name: 'no zones drawn', layout, config: { zones } },
    { name: 'zone outlines but no `zones` in the config: not read', layout: halves('LOBBY', 'STORAGE') },
  ],
  invalid: [
    {
      name: 'a label no pattern matches',
      layout: halves('LOBBY', 'STORAGE'),
      config: { zones },
      count: 1,
      severity: 'warning',
      params: { label: 'LOBBY', heads: 6, hazard: 'OH2' },
    },
    { name: 'a zone without a label', layout: halves(undefined, 'STORAGE'), config: { zones }, count: 1, params: { label: null } },
  ],
});
