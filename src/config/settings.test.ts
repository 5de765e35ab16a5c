// The config is read by one schema: an unknown key at any depth, a value of the wrong type or out of range is
// refused with the key's dotted path (and the nearest known key for a slip); SI values come out in US units.
// Conversion factors: 1 ft = 0.3048 m, 1 US gal = 3.785411784 L, 1 psi = 0.0689476 bar (NIST SP 811).

import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS, nearest, parseSettings, parseSettingsText } from './settings.js';

const refusal = (config: unknown) => {
  try {
    parseSettings(config, 'plan.config.json');
  } catch (err) {
    return (err as Error).message;
  }
  return null;
};

describe('config: unknown keys, at any depth, with the nearest known key', () => {
  const slips: [unknown, RegExp][] = [
    [{ design: { hazzard: 'EH1' } }, /^plan\.config\.json: unknown key "design\.hazzard" \(did you mean "design\.hazard"\?\)$/],
    [{ limits: { maxSpacng: 1 } }, /unknown key "limits\.maxSpacng" \(did you mean "limits\.maxSpacing"\?\)/],
    [{ supply: { static: 80, residual: 60, flow: 1000, flwo: 1 } }, /unknown key "supply\.flwo" \(did you mean "supply\.flow"\?\)/],
    [{ layers: { head: ['FP-HEAD'] } }, /unknown key "layers\.head" \(did you mean "layers\.heads"\?\)/],
    [{ defaults: { kfactor: 5.6 } }, /unknown key "defaults\.kfactor" \(did you mean "defaults\.kFactor"\?\)/],
    [{ tolerances: { snapp: 0.1 } }, /unknown key "tolerances\.snapp" \(did you mean "tolerances\.snap"\?\)/],
    [{ inputLimits: { fileMb: 10 } }, /unknown key "inputLimits\.fileMb" \(did you mean "inputLimits\.fileMB"\?\)/],
    [{ unitsystem: 'si' }, /unknown key "unitsystem" \(did you mean "unitSystem"\?\)/],
    [{ colour: 'red' }, /unknown key "colour"$/],
    [
      { zones: { '*STORAGE*': { hazzard: 'OH2' } } },
      /unknown key "zones\.\*STORAGE\*\.hazzard" \(did you mean "zones\.\*STORAGE\*\.hazard"\?\)/,
    ],
    [{ layers: { zone: ['FP-ZONE'] } }, /unknown key "layers\.zone" \(did you mean "layers\.zones"\?\)/],
  ];
  it.each(slips)('%j', (config, message) => expect(refusal(config)).toMatch(message));
});

describe('config: wrong types and values out of range name the key', () => {
  const bad: [unknown, RegExp][] = [
    [{ design: { density: 'high' } }, /"design\.density" must be a number, not "high"/],
    [{ design: { hazard: 'OH3' } }, /"design\.hazard" must be one of LH, OH1, OH2, EH1, EH2, not "OH3"/],
    [{ zones: { 'OFFICE*': { hazard: 'LH', density: 2 } } }, /"zones\.OFFICE\*\.density" must be at most 1 gpm\/ft², not 2/],
    [{ zones: { 'OFFICE*': {} } }, /"zones\.OFFICE\*\.hazard" is missing/],
    [{ zones: ['OFFICE'] }, /"zones" must be an object/],
    [{ design: { fittings: 'yes' } }, /"design\.fittings" must be true or false/],
    [{ unitSystem: 'metric' }, /"unitSystem" must be one of us, si/],
    [{ units: 'yd' }, /"units" must be one of in, ft, mm, cm, m/],
    [{ layers: { heads: [3] } }, /"layers\.heads" must be a name pattern or a list of them/],
    [{ defaults: { pipeSize: '1.3' } }, /"defaults\.pipeSize" must be a nominal pipe size/],
    [{ defaults: { schedule: 80 } }, /"defaults\.schedule" must be 10 or 40/],
    [{ supply: { static: 80, residual: 90, flow: 1000 } }, /"supply\.residual" must be lower than "supply\.static"/],
    [{ supply: { static: 80, residual: 60 } }, /"supply\.flow" is missing/],
    [{ design: [1] }, /"design" must be an object/],
    [{ inputLimits: { entities: 2.5 } }, /"inputLimits\.entities" must be a whole number/],
    [[1, 2], /the config must be a JSON object/],
    // 1 gpm/ft² is far above any density/area design (common practice): 8.1 is a density in mm/min (8.1 / 40.746 = 0.199 gpm/ft²).
    [
      { design: { density: 8.1 } },
      /"design\.density" must be at most 1 gpm\/ft², not 8\.1; it looks like a value in mm\/min: is "unitSystem": "si" meant\?/,
    ],
    // Listed K-factors end at 34.8 (NFPA 13 (2019 edition), Table 7.2.2.1, from memory): 80 is K 5.6 in L/min/bar½ (80 / 14.416).
    [{ defaults: { kFactor: 80 } }, /"defaults\.kFactor" must be at most 34\.8 gpm\/psi½, not 80; it looks like a value in L\/min\/bar½/],
    // In SI the same bounds read in SI units: 1 gpm/ft² = 40.75 mm/min.
    [{ unitSystem: 'si', design: { density: 0.2 } }, null as unknown as RegExp],
    [{ unitSystem: 'si', design: { density: 50 } }, /"design\.density" must be at most 40\.75 mm\/min, not 50/],
  ];
  it.each(bad.filter(([, m]) => m !== null))('%j', (config, message) => expect(refusal(config)).toMatch(message));

  it('every limit key refuses a negative value, naming its path', () => {
    for (const key of ['maxArea', 'maxSpacing', 'maxWallDistance', 'minWallDistance', 'minHeadDistance']) {
      expect(refusal({ limits: { [key]: -1 } })).toMatch(new RegExp(`"limits\\.${key}" must be greater than 0 ft²?, not -1`));
    }
  });

  it('every section refuses a key it does not know', () => {
    for (const section of ['layers', 'defaults', 'design', 'supply', 'limits', 'tolerances', 'inputLimits']) {
      const base = section === 'supply' ? { static: 80, residual: 60, flow: 1000 } : {};
      expect(refusal({ [section]: { ...base, zzz: 1 } })).toMatch(new RegExp(`unknown key "${section}\\.zzz"`));
    }
  });

  it('not JSON at all', () => {
    expect(() => parseSettingsText('{ design: ', 'a.json')).toThrow(/^a\.json: not valid JSON/);
  });
});

describe('config: defaults and units', () => {
  it('an empty config is the defaults (K 5.6, 1 in Schedule 40, C 120, OH2, heads at 12 ft)', () => {
    const s = parseSettings({});
    expect(s).toEqual(DEFAULT_SETTINGS);
    expect(s.defaults).toEqual({ kFactor: 5.6, pipeSize: '1', cFactor: 120, schedule: '40', headElevation: 12, sourceElevation: 0 });
    expect(s.design).toMatchObject({ hazard: 'OH2', minHeadPressure: 7, areaMode: 'both', systemType: 'wet' });
    expect(s.tolerances.snap).toBeCloseTo(1 / 12, 12);
  });

  it('SI values come out in US units: 8.15 mm/min, 139.35 m², 5.5 bar, 3785.4 L/min, 80.7 K, 3.66 m', () => {
    const s = parseSettings({
      unitSystem: 'si',
      defaults: { kFactor: 80.7, headElevation: 3.6576 },
      design: { density: 8.1492, area: 139.3546 },
      supply: { static: 5.5, residual: 4, flow: 3785.411784 },
      limits: { maxSpacing: 4.572 },
    });
    expect(s.design.density).toBeCloseTo(0.2, 4);
    expect(s.design.area).toBeCloseTo(1500, 2);
    expect(s.supply!.static).toBeCloseTo(5.5 / 0.0689476, 3);
    expect(s.supply!.flow).toBeCloseTo(1000, 9);
    expect(s.defaults.kFactor).toBeCloseTo(5.598, 3);
    expect(s.defaults.headElevation).toBeCloseTo(12, 9);
    expect(s.limits.maxSpacing).toBeCloseTo(15, 9);
    // defaults are the same US values whatever the system
    expect(parseSettings({ unitSystem: 'si' }).defaults.kFactor).toBeCloseTo(5.6, 12);
  });

  it('a single pattern is a list of one; pipe sizes and schedules are normalised', () => {
    const s = parseSettings({ layers: { heads: 'FP-HEAD' }, defaults: { pipeSize: 1.25, schedule: 10 } });
    expect(s.layers.heads).toEqual(['FP-HEAD']);
    expect(s.defaults.pipeSize).toBe('1-1/4');
    expect(s.defaults.schedule).toBe('10');
  });

  it('"did you mean" only for a near key', () => {
    expect(nearest('hazzard', ['hazard', 'density'])).toBe('hazard');
    expect(nearest('colour', ['units', 'design'])).toBeNull();
  });
});
