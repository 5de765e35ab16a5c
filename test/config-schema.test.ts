// The published JSON Schema and the README's config reference are generated from the config schema and must be
// current; an independent validator (ajv, from the npm registry) accepts every config the tool accepts in
// fixtures/, the demo's and the real-drawing corpus's, and refuses the misspelt one as the tool does.

import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import Ajv from 'ajv';
import { contractPath } from './support/supply-path.js';
import { describe, expect, it } from 'vitest';
import { configJsonSchema, SCHEMA_FILE, withSections } from '../scripts/docs.js';
import { parseSettings } from '../src/config/settings.js';
import { DEMO_CONFIG } from '../src/demo/scenario.js';

const schema = configJsonSchema();
const validate = new Ajv({ allErrors: true, strict: true }).compile(schema);
const fixtures = readdirSync('fixtures/configs').map((f) => [f, JSON.parse(readFileSync(join('fixtures/configs', f), 'utf8'))] as const);
const SHARED_CONFIGS = '../shared/real-dxf/configs';

describe('published config schema', () => {
  it(`${SCHEMA_FILE} and the README's generated sections are current (run npm run docs)`, () => {
    expect(JSON.parse(readFileSync(SCHEMA_FILE, 'utf8'))).toEqual(schema);
    const readme = readFileSync('README.md', 'utf8');
    expect(withSections(readme)).toBe(readme);
  });

  it('ajv and the tool agree on every fixture config and the demo config', () => {
    const all = [...fixtures, ['demo', DEMO_CONFIG] as const];
    expect(all.length).toBeGreaterThanOrEqual(4);
    for (const [name, config] of all) {
      const toolAccepts = (() => {
        try {
          parseSettings(config, name);
          return true;
        } catch {
          return false;
        }
      })();
      expect({ name, ajv: validate(config) }).toEqual({ name, ajv: toolAccepts });
    }
    expect(validate(fixtures.find(([n]) => n === 'misspelt.json')![1])).toBe(false);
    expect(validate.errors!.map((e) => e.params)).toContainEqual({ additionalProperty: 'hazzard' });
  });

  it('ajv refuses what the tool refuses: a negative spacing, an SI density read as US, a wrong type', () => {
    for (const bad of [
      { limits: { maxSpacing: -1 } },
      { design: { density: 8.1 } },
      { design: { fittings: 'yes' } },
      { supply: { static: 80 } },
    ]) {
      expect(validate(bad)).toBe(false);
      expect(() => parseSettings(bad)).toThrow();
    }
    expect(validate({ unitSystem: 'si', design: { density: 8.1 } })).toBe(true);
  });

  it("the supply path: the contract's example is accepted by both, a wrong part refused by both", () => {
    // CONTRACT.md, "Supply path": the three parts as it writes them.
    const path = contractPath();
    const good = { supply: { static: 80, residual: 60, flow: 1000, elevation: -4, path } };
    expect(validate(good)).toBe(true);
    expect(parseSettings(good).supply!.path![0]).toMatchObject({ type: 'pipe', size: '6', schedule: '40' });
    for (const part of [
      { type: 'valve', name: 'x', loss: [[0, 1]] },
      { type: 'pipe', lenght: 300, size: '6' },
      { type: 'pump', name: 'p', curve: [[0, 120, 3]] },
      { type: 'device', name: 'd', loss: [] },
    ]) {
      const bad = { supply: { ...good.supply, path: [part] } };
      expect({ part, ajv: validate(bad) }).toEqual({ part, ajv: false });
      expect(() => parseSettings(bad)).toThrow(/supply\.path/);
    }
    // Flows must rise along a curve: the tool says so (JSON Schema cannot).
    const unordered = {
      supply: {
        ...good.supply,
        path: [
          {
            type: 'device',
            name: 'd',
            loss: [
              [500, 7],
              [0, 4],
            ],
          },
        ],
      },
    };
    expect(() => parseSettings(unordered)).toThrow(/must list flows rising/);
  });

  it.skipIf(!existsSync(SHARED_CONFIGS))('accepts every config of the real-drawing corpus (../shared)', () => {
    for (const dir of readdirSync(SHARED_CONFIGS)) {
      for (const f of readdirSync(join(SHARED_CONFIGS, dir))) {
        const config = JSON.parse(readFileSync(join(SHARED_CONFIGS, dir, f), 'utf8'));
        expect({ f, ok: validate(config) }).toEqual({ f, ok: true });
        parseSettings(config, f);
      }
    }
  });
});
