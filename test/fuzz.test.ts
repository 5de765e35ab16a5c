// Fuzzing the whole pipeline (fast-check): mutated and truncated fixtures — dropped lines, swapped group
// codes, huge numbers, NaN/Infinity, negative counts, enormous strings — end in a report or an InputError,
// never another exception or a hang. Failing cases found are kept in fixtures/fuzz as regression cases.
//
// Seeds are fixed so the suite is repeatable; FUZZ_SEED (a number, or "random") and FUZZ_RUNS explore further
// (`npm run fuzz`); a failure prints its seed and path to replay it. Other property tests: PROPERTY_SEED.

import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { DEMO_CONFIG, demoDrawing } from '../src/demo/scenario.js';
import { GuardedPipeline, type Outcome } from './support/guarded-pipeline.js';

const sources: { text: string; encoding: 'latin1' | 'utf8'; config: unknown }[] = [
  { text: readFileSync('fixtures/bay2-r2000.dxf', 'latin1'), encoding: 'latin1', config: {} },
  { text: readFileSync('fixtures/bay2-r2018.dxf', 'utf8'), encoding: 'utf8', config: {} },
  { text: demoDrawing(), encoding: 'utf8', config: DEMO_CONFIG },
];

const seed = (fallback: number) => {
  const given = process.env['FUZZ_SEED'];
  return !given ? fallback : given === 'random' ? Math.floor(Math.random() * 2 ** 31) : Number(given);
};
const runs = (fallback: number) => (process.env['FUZZ_RUNS'] ? Number(process.env['FUZZ_RUNS']) : fallback);
/** Generous for the three small drawings (each checks in well under a second); a stall is a hang. */
const TIME_LIMIT_MS = 20_000;

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

const pipeline = new GuardedPipeline(TIME_LIMIT_MS);
afterAll(() => pipeline.close());

function expectHandled(outcome: Outcome): void {
  if (outcome.outcome === 'hang' || outcome.outcome === 'crash') throw new Error(`${outcome.outcome}: ${outcome.message}`);
  if (outcome.outcome === 'input-error') expect(outcome.message.split('\n')).toHaveLength(1);
}

describe('fuzzing the pipeline', () => {
  it('mutated drawings end in a report or a one-line InputError', async () => {
    await fc.assert(fc.asyncProperty(
      fc.integer({ min: 0, max: sources.length - 1 }),
      fc.array(fc.record({ kind: fc.nat(), at: fc.nat(), value: fc.constantFrom(...VALUES) }), { minLength: 1, maxLength: 6 }),
      async (i, ms) => {
        const { text, encoding, config } = sources[i]!;
        expectHandled(await pipeline.run(new Uint8Array(Buffer.from(mutate(text, ms), encoding)), config));
      },
    ), { numRuns: runs(300), seed: seed(20261202), endOnFailure: true });
  });

  it('truncated drawings (cut anywhere) end in a report or an InputError', async () => {
    await fc.assert(fc.asyncProperty(fc.integer({ min: 0, max: sources.length - 1 }), fc.double({ min: 0, max: 1, noNaN: true }), async (i, f) => {
      const { text, encoding, config } = sources[i]!;
      const bytes = new Uint8Array(Buffer.from(text, encoding));
      expectHandled(await pipeline.run(bytes.subarray(0, Math.floor(bytes.length * f)), config));
    }), { numRuns: runs(100), seed: seed(1202), endOnFailure: true });
  });
});
