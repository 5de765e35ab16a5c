// Which heads the standard-spray limit table applies to: heads whose attributes say nothing else.
// Sidewall, extended-coverage and other listed heads are reported by head-type-unchecked instead.

import type { Head } from '../read/plan.js';

export const isStandardSpray = (h: Head): boolean => h.kind === 'standard';
