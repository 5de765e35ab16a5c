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

const VALUES = [
  'NaN',
  'Infinity',
  '-Infinity',
  '1e308',
  '-1e308',
  '-5',
  '0',
  '999999999',
  '',
  'SECTION',
  'EOF',
  'x'.repeat(100_000),
  '\u0000',
  '1.0.0',
];

function mutate(text: string, ms: Mutation[]): string {
  const lines = text.split('\n');
  for (const m of ms) {
    const i = m.at % Math.max(1, lines.length);
    switch (m.kind % 6) {
      case 0:
        lines.splice(i, 1);
        break; // drop a line
      case 1:
        lines.splice(i, 2);
        break; // drop a group
      case 2:
        lines[i] = m.value;
        break; // replace a value or a code
      case 3:
        if (i + 2 < lines.length) [lines[i], lines[i + 2]] = [lines[i + 2]!, lines[i]!];
        break; // swap codes
      case 4:
        lines.splice(i, 0, m.value, m.value);
        break; // insert a bogus group
      case 5:
        lines.length = Math.max(1, i);
        lines.push('  0', 'EOF');
        break; // truncate, keep EOF
    }
  }
  return lines.join('\n');
}

/**
 * Structural mutations, on groups rather than lines: section, block and table ends swapped, doubled or dropped,
 * arrays and vertex counts made huge or negative, references to blocks that do not exist, handles that are not
 * hexadecimal, coordinates and scales huge, tiny or not numbers.
 */
type Edit = { kind: number; at: number; pick: number };

const ENDS = ['ENDSEC', 'ENDBLK', 'ENDTAB', 'SEQEND', 'EOF', 'SECTION', 'BLOCK', 'TABLE'];
const COUNTS = ['100000', '-1', '-100000', '2147483647', '0', '1e9'];
const NUMBERS = ['1e308', '-1e308', '1e-308', '-0', 'NaN', 'Infinity', '1e20', '0x10'];
const HANDLES = ['ZZZZ', '', '-1', 'FFFFFFFFFFFFFFFFFFFF', '0', '\u00ff\u00fe'];

function structural(text: string, edits: Edit[]): string {
  const lines = text.split('\n');
  const groups: [string, string][] = [];
  for (let i = 0; i + 1 < lines.length; i += 2) groups.push([lines[i]!, lines[i + 1]!]);
  const code = (g: [string, string]) => Number(g[0].trim());
  const find = (accept: (g: [string, string]) => boolean, from: number) => {
    for (let k = 0; k < groups.length; k++) {
      const i = (from + k) % groups.length;
      if (accept(groups[i]!)) return i;
    }
    return -1;
  };
  for (const e of edits) {
    const pick = <T>(xs: T[]) => xs[e.pick % xs.length]!;
    const at = e.at % Math.max(1, groups.length);
    switch (e.kind % 7) {
      case 0: {
        // an end record moved elsewhere
        const i = find((g) => code(g) === 0 && ENDS.includes(g[1].trim()), at);
        if (i >= 0) {
          const [g] = groups.splice(i, 1);
          groups.splice((at * 7) % Math.max(1, groups.length), 0, g!);
        }
        break;
      }
      case 1: {
        const i = find((g) => code(g) === 0 && ENDS.includes(g[1].trim()), at);
        if (i >= 0) groups.splice(i, 0, groups[i]!);
        break;
      } // doubled
      case 2: {
        const i = find((g) => code(g) === 0 && ENDS.includes(g[1].trim()), at);
        if (i >= 0) groups.splice(i, 1);
        break;
      } // dropped
      case 3: {
        // an array or count made huge or negative (MINSERT columns/rows, vertex counts, flags)
        const i = find((g) => [70, 71, 90, 44, 45].includes(code(g)), at);
        if (i >= 0) groups[i] = [groups[i]![0], pick(COUNTS)];
        break;
      }
      case 4: {
        const i = find((g) => code(g) === 2, at);
        if (i >= 0) groups[i] = [groups[i]![0], `NO-SUCH-BLOCK-${e.pick}`];
        break;
      }
      case 5: {
        const i = find((g) => code(g) === 5, at);
        if (i >= 0) groups[i] = [groups[i]![0], pick(HANDLES)];
        break;
      }
      case 6: {
        const i = find((g) => [10, 20, 11, 21, 40, 41, 42, 50, 51].includes(code(g)), at);
        if (i >= 0) groups[i] = [groups[i]![0], pick(NUMBERS)];
        break;
      }
    }
  }
  return [...groups.flat(), ...(lines.length % 2 ? [lines.at(-1)!] : [])].join('\n');
}

const pipeline = new GuardedPipeline(TIME_LIMIT_MS);
afterAll(() => pipeline.close());

function expectHandled(outcome: Outcome): void {
  if (outcome.outcome === 'hang' || outcome.outcome === 'crash') throw new Error(`${outcome.outcome}: ${outcome.message}`);
  if (outcome.outcome === 'input-error') expect(outcome.message.split('\n')).toHaveLength(1);
}

/** A property test's own time: enough for its runs (each well under a second), so a long campaign is not cut short. */
const timeFor = (n: number) => 60_000 + n * 500;

describe('fuzzing the pipeline', () => {
  it('mutated drawings end in a report or a one-line InputError', { timeout: timeFor(runs(300)) }, async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.integer({ min: 0, max: sources.length - 1 }),
        fc.array(fc.record({ kind: fc.nat(), at: fc.nat(), value: fc.constantFrom(...VALUES) }), { minLength: 1, maxLength: 6 }),
        async (i, ms) => {
          const { text, encoding, config } = sources[i]!;
          expectHandled(await pipeline.run(new Uint8Array(Buffer.from(mutate(text, ms), encoding)), config));
        },
      ),
      { numRuns: runs(300), seed: seed(20261202), endOnFailure: true },
    );
  });

  it('structural mutants (ends moved, doubled, dropped; huge counts; missing blocks; bad handles; extreme numbers) end in a report or a one-line InputError, within 1 GiB', {
    timeout: timeFor(runs(300)),
  }, async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.integer({ min: 0, max: sources.length - 1 }),
        fc.array(fc.record({ kind: fc.nat(), at: fc.nat(), pick: fc.nat() }), { minLength: 1, maxLength: 5 }),
        async (i, edits) => {
          const { text, encoding, config } = sources[i]!;
          expectHandled(await pipeline.run(new Uint8Array(Buffer.from(structural(text, edits), encoding)), config));
        },
      ),
      { numRuns: runs(300), seed: seed(1122), endOnFailure: true },
    );
  });

  it('truncated drawings (cut anywhere) end in a report or an InputError', { timeout: timeFor(runs(100)) }, async () => {
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 0, max: sources.length - 1 }), fc.double({ min: 0, max: 1, noNaN: true }), async (i, f) => {
        const { text, encoding, config } = sources[i]!;
        const bytes = new Uint8Array(Buffer.from(text, encoding));
        expectHandled(await pipeline.run(bytes.subarray(0, Math.floor(bytes.length * f)), config));
      }),
      { numRuns: runs(100), seed: seed(1202), endOnFailure: true },
    );
  });
});
