// The config file's one schema: every key with its type, unit, range, default and meaning. The TypeScript type
// of the settings, their defaults, the validation and the published JSON Schema all come from it.

import * as v from 'valibot';
import { KSI_PER_KUS, L_PER_GAL, M2_PER_FT2, M_PER_FT, MMMIN_PER_GPMFT2, BAR_PER_PSI, type UnitSystem } from '../quantities/convert.js';
import { NOMINAL_SIZES, normaliseSize, type NominalSize, type Schedule } from '../quantities/pipe-sizes.js';
import { HAZARDS, LENGTH_UNITS } from './names.js';

/** Physical quantities of config values: the unit each system writes them in, and the factor from US to SI. */
export const QUANTITIES = {
  length: { us: 'ft', si: 'm', siPerUs: M_PER_FT },
  area: { us: 'ft²', si: 'm²', siPerUs: M2_PER_FT2 },
  flow: { us: 'gpm', si: 'L/min', siPerUs: L_PER_GAL },
  pressure: { us: 'psi', si: 'bar', siPerUs: BAR_PER_PSI },
  density: { us: 'gpm/ft²', si: 'mm/min', siPerUs: MMMIN_PER_GPMFT2 },
  kFactor: { us: 'gpm/psi½', si: 'L/min/bar½', siPerUs: KSI_PER_KUS },
  number: { us: '', si: '', siPerUs: 1 },
} as const;
export type QuantityKind = keyof typeof QUANTITIES;

/** What the reference and the error messages say of a numeric key, beside its schema. */
export interface QuantityMeta {
  kind: QuantityKind;
  /** Range and default in US units (the tool's internal units): at least `min`, or more than `above`; at most `max`. */
  min?: number;
  above?: number;
  max: number;
  default?: number;
  /** Where the range comes from. */
  rangeSource: string;
  /** A typical value, in US units, for the reference (keys without a default). */
  example?: number;
}

const from = (kind: QuantityKind, system: UnitSystem) => (us: number) => (system === 'us' ? us : us * QUANTITIES[kind].siPerUs);
const toUs = (kind: QuantityKind, system: UnitSystem) => (value: number) => (system === 'us' ? value : value / QUANTITIES[kind].siPerUs);
const unitOf = (kind: QuantityKind, system: UnitSystem) => (QUANTITIES[kind][system] ? ` ${QUANTITIES[kind][system]}` : '');
/** A bound as the message shows it: four significant figures. */
const shown = (x: number) => String(+x.toPrecision(4));

/** Whether a value out of range would be in range read in the other unit system: the likely mix-up, said. */
function mixUp(meta: QuantityMeta, system: UnitSystem, value: unknown): string {
  if (meta.kind === 'number' || typeof value !== 'number') return '';
  const other: UnitSystem = system === 'us' ? 'si' : 'us';
  const us = toUs(meta.kind, other)(value);
  const inside = (meta.min === undefined || us >= meta.min) && (meta.above === undefined || us > meta.above) && us <= meta.max;
  return inside ? `; it looks like a value in${unitOf(meta.kind, other)}: is "unitSystem": "${other}" meant?` : '';
}

/**
 * A numeric key: checked in the config's own unit system, handed on in US units (feet, ft², gpm, psi, gpm/ft²,
 * US K-factors). Bounds and default are given in US units and shown in the config's.
 */
function quantity(system: UnitSystem, meta: QuantityMeta, description: string) {
  const f = from(meta.kind, system);
  const u = unitOf(meta.kind, system);
  const said = (what: string) => (issue: v.BaseIssue<unknown>) =>
    `must be ${what}, not ${String(issue.input)}${mixUp(meta, system, issue.input)}`;
  const low = meta.above ?? meta.min!;
  const lower: v.PipeItem<number, number, v.BaseIssue<unknown>> = meta.above !== undefined
    ? v.gtValue<number, number, v.ErrorMessage<v.GtValueIssue<number, number>>>(f(low), said(`greater than ${shown(f(low))}${u}`))
    : v.minValue<number, number, v.ErrorMessage<v.MinValueIssue<number, number>>>(f(low), said(`at least ${shown(f(low))}${u}`));
  return v.pipe(
    v.number('must be a number'),
    lower,
    v.maxValue(f(meta.max), said(`at most ${shown(f(meta.max))}${u}`)),
    v.description<number, string>(`${description}${u ? ` (${u.trim()})` : ''}`),
    v.metadata<number, { quantity: QuantityMeta }>({ quantity: meta }),
    v.examples<number, number[]>(meta.example === undefined ? [] : [+f(meta.example).toPrecision(4)]),
    v.transform<number, number>(toUs(meta.kind, system)),
  );
}

/** A numeric key with a default, and one whose absence means something (no default). */
const defaulted = (system: UnitSystem, meta: QuantityMeta & { default: number }, description: string) =>
  v.optional(quantity(system, meta, description), from(meta.kind, system)(meta.default));
const optionalQuantity = (system: UnitSystem, meta: QuantityMeta, description: string) => v.optional(quantity(system, meta, description));

/** A whole number greater than zero, or from `least` up (the input limits). */
const count = (fallback: number, description: string, least?: { value: number; why: string }) =>
  v.optional(
    v.pipe(
      v.number('must be a number'),
      v.integer('must be a whole number'),
      least ? v.minValue(least.value, `must be at least ${least.value} (${least.why})`) : v.gtValue(0, 'must be greater than 0'),
      v.description<number, string>(description),
    ),
    fallback,
  );

const text = (description: string, example: string) =>
  v.pipe(v.string('must be a text'), v.description(description), v.examples([example]));
const choice = <T extends readonly string[]>(options: T, description: string, example: T[number] = options[0]!) =>
  v.pipe(v.picklist(options, `must be one of ${options.join(', ')}`), v.description(description), v.examples([example]));
const flag = (description: string, fallback: boolean) =>
  v.optional(v.pipe(v.boolean('must be true or false'), v.description(description)), fallback);
/** A list of name patterns; a single text is a list of one. */
const patterns = (description: string, example: string[]) =>
  v.pipe(
    v.union([v.string(), v.array(v.string())], 'must be a name pattern or a list of them'),
    v.description(description),
    v.examples([example]),
    v.transform((x): string[] => (typeof x === 'string' ? [x] : x)),
  );
const section = <E extends v.ObjectEntries>(entries: E, description: string) =>
  v.pipe(v.strictObject(entries, 'must be an object'), v.description(description));

const NOT_SOURCED = 'common practice, no source: far outside any real value, so a typo is caught';

const nominalSize = (description: string) =>
  v.pipe(
    v.union([v.string(), v.number()], 'must be a pipe size such as "1-1/4"'),
    v.transform((x) => normaliseSize(String(x))),
    v.check((x): x is NominalSize => x !== null, `must be a nominal pipe size (${NOMINAL_SIZES.join(', ')} in, or DN)`),
    v.transform((x) => x as NominalSize),
    v.description(description),
  );
const schedule = v.pipe(
  v.union([v.picklist(['10', '40']), v.picklist([10, 40])], 'must be 10 or 40'),
  v.transform((x) => String(x) as Schedule),
  v.description('Steel pipe schedule for inside diameters: 10 or 40'),
);

/** The schema of a config whose values are written in `system`'s units. */
export function configSchema(system: UnitSystem) {
  const q = (meta: QuantityMeta & { default: number }, description: string) => defaulted(system, meta, description);
  const maybe = (meta: QuantityMeta, description: string) => optionalQuantity(system, meta, description);
  const limit = (kind: QuantityKind, max: number, example: number, description: string) =>
    maybe({ kind, above: 0, max, example, rangeSource: NOT_SOURCED }, description);

  const densityMeta: QuantityMeta = {
    kind: 'density',
    above: 0,
    max: 1,
    example: 0.2,
    rangeSource: 'common practice: densities of the density/area method lie between 0.05 and 0.6 gpm/ft²',
  };
  const areaMeta: QuantityMeta = { kind: 'area', above: 0, max: 20_000, example: 1500, rangeSource: NOT_SOURCED };

  /** Points [flow, pressure], flows rising: a device's loss or a pump's boost. */
  const curve = (what: string) =>
    v.pipe(
      v.array(
        v.strictTuple(
          [
            quantity(system, { kind: 'flow', min: 0, max: 20_000, example: 500, rangeSource: NOT_SOURCED }, 'Flow'),
            quantity(system, { kind: 'pressure', min: 0, max: 400, example: 7, rangeSource: NOT_SOURCED }, 'Pressure'),
          ],
          'must be a pair [flow, pressure]',
        ),
        'must be a list of [flow, pressure] pairs',
      ),
      v.minLength(1, 'must hold at least one [flow, pressure] pair'),
      v.check((points) => points.every((p, i) => i === 0 || p[0] > points[i - 1]![0]), 'must list flows rising'),
      v.description(what),
    );
  const pathPart = v.variant(
    'type',
    [
      v.strictObject({
        type: v.literal('pipe'),
        length: quantity(system, { kind: 'length', above: 0, max: 50_000, example: 300, rangeSource: NOT_SOURCED }, 'Length of the pipe'),
        size: nominalSize('Nominal size (inches, e.g. "6", or DN150)'),
        cFactor: q(
          {
            kind: 'number',
            min: 50,
            max: 200,
            default: 140,
            rangeSource: 'common practice: Hazen-Williams C of pipe lies between 100 and 150',
          },
          'Hazen-Williams C (default 140: cement-lined)',
        ),
        schedule: v.optional(schedule, '40'),
        rise: q(
          { kind: 'length', min: -1000, max: 1000, default: 0, rangeSource: NOT_SOURCED },
          'Rise from its upstream end to its downstream end',
        ),
      }),
      v.strictObject({
        type: v.literal('device'),
        name: text('What the device is', 'backflow preventer'),
        loss: curve("The device's pressure loss at flows, interpolated between points, held past the last"),
      }),
      v.strictObject({
        type: v.literal('pump'),
        name: text('What the pump is', 'fire pump'),
        curve: curve("The pump's pressure boost at flows, interpolated between points; none past the last"),
      }),
    ],
    'must have "type" pipe, device or pump',
  );

  const supply = v.pipe(
    v.strictObject(
      {
        static: quantity(
          system,
          { kind: 'pressure', above: 0, max: 400, example: 80, rangeSource: NOT_SOURCED },
          'Static pressure of the flow test',
        ),
        residual: quantity(
          system,
          { kind: 'pressure', min: 0, max: 400, example: 60, rangeSource: NOT_SOURCED },
          'Residual pressure while flowing `flow`',
        ),
        flow: quantity(system, { kind: 'flow', above: 0, max: 20_000, example: 1000, rangeSource: NOT_SOURCED }, 'Flow of the flow test'),
        elevation: maybe(
          { kind: 'length', min: -1000, max: 3000, example: -4, rangeSource: NOT_SOURCED },
          "Elevation of the flow-test point, same datum as the source (default: the source's)",
        ),
        path: v.optional(
          v.pipe(
            v.array(pathPart, 'must be a list of parts (pipe, device, pump)'),
            v.description('The parts between the flow-test point and the source, in order from the test point'),
          ),
        ),
      },
      'must be an object with static, residual and flow',
    ),
    v.description('A flow test (at the source unless a path leads from it): static pressure, residual pressure while flowing a flow'),
    v.forward(
      v.check((s) => s.residual < s.static, 'must be lower than "supply.static"'),
      ['residual'],
    ),
  );

  return v.strictObject(
    {
      $schema: v.optional(
        text('The JSON Schema this config follows (for editors); not read by the tool', './node_modules/headcheck/headcheck.schema.json'),
      ),
      comment: v.optional(text('Free text for people; not read by the tool', 'ground floor, second submittal')),
      units: v.optional(choice(LENGTH_UNITS, "The drawing's length unit; overrides the drawing header's $INSUNITS", 'in')),
      unitSystem: v.optional(
        choice(['us', 'si'] as const, "Unit system of the config's own values: us (ft, gpm, psi) or si (m, L/min, bar)"),
        'us',
      ),
      layers: v.optional(
        section(
          {
            heads: v.optional(patterns('Layers holding sprinkler heads', ['FP-HEAD*'])),
            pipes: v.optional(patterns('Layers holding pipe linework', ['FP-PIPE*'])),
            walls: v.optional(patterns('Layers holding walls and room outlines', ['A-WALL*'])),
            designArea: v.optional(patterns('Layers holding drawn design areas', ['FP-AREA'])),
            source: v.optional(patterns('Layers holding the water source (riser)', ['FP-RISER'])),
            zones: v.optional(patterns('Layers holding hazard-zone outlines and their labels', ['FP-ZONE'])),
          },
          'Layer name patterns per role (case-insensitive, * matches any run); a role without patterns is guessed',
        ),
        {},
      ),
      headBlocks: v.optional(patterns('Block names of head symbols (patterns)', ['SPK*', 'HEAD*']), ['*']),
      defaults: v.optional(
        section(
          {
            kFactor: q(
              {
                kind: 'kFactor',
                min: 1.3,
                max: 34.8,
                default: 5.6,
                rangeSource: 'NFPA 13 (2019 edition), Table 7.2.2.1: listed K-factors 1.3 to 34.8 (from memory)',
              },
              'K-factor of a head without a K attribute',
            ),
            pipeSize: v.optional(nominalSize('Nominal size of a pipe without a size label (inches, e.g. "1-1/4", or DN32)'), '1'),
            cFactor: q(
              {
                kind: 'number',
                min: 50,
                max: 200,
                default: 120,
                rangeSource: 'common practice: Hazen-Williams C of sprinkler pipe lies between 100 and 150',
              },
              'Hazen-Williams C of every pipe',
            ),
            schedule: v.optional(schedule, '40'),
            headElevation: q(
              { kind: 'length', min: -1000, max: 3000, default: 12, rangeSource: NOT_SOURCED },
              'Elevation of a head without an ELEV attribute, and of the piping',
            ),
            sourceElevation: q(
              { kind: 'length', min: -1000, max: 3000, default: 0, rangeSource: NOT_SOURCED },
              'Elevation of the source (where the supply is known)',
            ),
          },
          'Values used where the drawing says nothing',
        ),
        {},
      ),
      design: v.optional(
        section(
          {
            hazard: v.optional(choice(HAZARDS, 'Occupancy hazard: LH, OH1, OH2, EH1 or EH2', 'OH2'), 'OH2'),
            density: maybe(densityMeta, "Design density (default: the hazard's curve)"),
            area: maybe(areaMeta, "Design area before adjustments (default: the hazard's curve)"),
            hoseAllowance: maybe(
              { kind: 'flow', min: 0, max: 2000, example: 250, rangeSource: NOT_SOURCED },
              'Hose-stream allowance added at the source (default: by hazard)',
            ),
            minHeadPressure: q(
              {
                kind: 'pressure',
                above: 0,
                max: 175,
                default: 7,
                rangeSource: 'from memory: 175 psi is the usual rating of sprinkler components',
              },
              'Least pressure at a flowing head',
            ),
            fittings: flag('Add equivalent lengths of elbows and tees inferred from the topology', true),
            velocityPressure: flag(
              'Heads flow at the normal pressure (total less velocity pressure where water runs past them, NFPA 13 (2016 edition), 23.4.4.10); false: at the total pressure',
              false,
            ),
            systemType: v.optional(
              choice(['wet', 'dry', 'preaction'] as const, 'wet, dry or preaction (dry and preaction add 30% to the area)'),
              'wet',
            ),
            areaMode: v.optional(
              choice(['drawn', 'search', 'both'] as const, 'drawn: check the drawn area; search: find the most demanding; both'),
              'both',
            ),
            quickResponse: flag('Quick-response heads: the area reduction applies where allowed', false),
            ceilingHeight: maybe(
              { kind: 'length', above: 0, max: 200, example: 12, rangeSource: NOT_SOURCED },
              'Ceiling height, for the quick-response reduction',
            ),
            ceilingSlope: maybe(
              { kind: 'number', min: 0, max: 10, example: 0.25, rangeSource: NOT_SOURCED },
              'Ceiling slope as rise over run (over 2/12 adds 30% to the area)',
            ),
          },
          'The design basis',
        ),
        {},
      ),
      zones: v.optional(
        v.pipe(
          v.record(
            v.string(),
            section(
              {
                hazard: choice(HAZARDS, "The zone's occupancy hazard", 'LH'),
                density: maybe(densityMeta, "The zone's design density (default: its hazard's curve)"),
                area: maybe(areaMeta, "The zone's design area before adjustments (default: its hazard's curve)"),
              },
              'The design basis of the zones whose label matches',
            ),
            'must be an object of label patterns',
          ),
          v.description(
            'Design basis per hazard zone: label patterns (case-insensitive, * matches any run) to { hazard, density, area }; the first match wins',
          ),
          v.examples([{ '*STORAGE*': { hazard: 'OH2', density: 0.2, area: 1500 }, 'OFFICE*': { hazard: 'LH' } }]),
        ),
        {},
      ),
      supply: v.optional(supply),
      limits: v.optional(
        section(
          {
            maxArea: limit('area', 1000, 130, 'Largest protection area per head'),
            maxSpacing: limit('length', 50, 15, 'Largest distance between heads and between branch lines'),
            maxWallDistance: limit('length', 25, 7.5, 'Largest distance from a head to a wall'),
            minWallDistance: limit('length', 5, 0.333, 'Least distance from a head to a wall'),
            minHeadDistance: limit('length', 20, 6, 'Least distance between heads'),
          },
          "Overrides of the rules' limit table, for the locally adopted edition",
        ),
        {},
      ),
      tolerances: v.optional(
        section(
          {
            snap: q(
              { kind: 'length', above: 0, max: 5, default: 1 / 12, rangeSource: NOT_SOURCED },
              'Pipe ends closer than this are joined',
            ),
            headAttach: q(
              { kind: 'length', above: 0, max: 10, default: 0.5, rangeSource: NOT_SOURCED },
              'A head this close to a pipe is on it',
            ),
            sizeLabel: q(
              { kind: 'length', above: 0, max: 20, default: 3, rangeSource: NOT_SOURCED },
              'A size label this close to a pipe sizes it',
            ),
          },
          'Geometry tolerances',
        ),
        {},
      ),
      inputLimits: v.optional(
        section(
          {
            fileMB: q({ kind: 'number', above: 0, max: 1_048_576, default: 512, rangeSource: NOT_SOURCED }, 'Largest drawing file, MiB'),
            entities: count(5_000_000, 'Most entities in the file, blocks included'),
            blockDepth: count(32, 'Deepest block nesting'),
            blockReferences: count(2_000_000, 'Most block references once nesting and arrays are multiplied out'),
            expandedEntities: count(1_000_000, 'Most entities the read layers hold once blocks are multiplied out (arrays and nesting)'),
            heads: count(100_000, 'Most head symbols on the head layers'),
            textLength: count(65_536, 'Longest value (a text, a name), characters'),
            networkNodes: count(1_000_000, 'Most nodes of the rebuilt piping'),
            dwgSeconds: count(120, 'Longest a DWG drawing may take to read, seconds'),
            dwgMemoryMB: count(2048, 'Most memory reading a DWG drawing may take, MiB (its reader reserves 1 GiB at start)', {
              value: 1024,
              why: 'the DWG reader reserves 1 GiB of address space at start and uses what the drawing needs of it',
            }),
          },
          'How much a drawing may cost before it is refused (each far above real plans)',
        ),
        {},
      ),
    },
    'must be a JSON object',
  );
}

export type ConfigSchema = ReturnType<typeof configSchema>;
/** The config as the stages use it: every default filled in, every value in US units. */
export type Settings = v.InferOutput<ConfigSchema>;
export type InputLimits = Settings['inputLimits'];
export type SystemType = Settings['design']['systemType'];
export type DesignSettings = Settings['design'];
export type ZoneSettings = Settings['zones'][string];
