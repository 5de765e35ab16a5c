// The words of every finding, in one table: each kind's parameters (as the rule returns them, internal US units)
// and the sentence that renders them in the report's units. Reports, the annotated drawing and the command line
// all take a finding's message from here.

import type { Hazard, LengthUnit } from '../config/settings.js';
import type { Formatter } from '../quantities/format.js';
import type { Finding, FindingKind } from './types.js';

/** Each kind of finding and the data its message is made of. */
export interface FindingParams {
  'config-units-header': { config: LengthUnit; header: LengthUnit };
  'config-units-mixed': { key: string; written: number; unit: string; otherUnit: string; otherSystem: string };
  'design-basis-below-curve': { zone: string | null } & (
    | { kind: 'area'; hazard: Hazard; area: number; minArea: number; startDensity: number }
    | { kind: 'density'; hazard: Hazard; density: number; area: number; need: number; atArea: number }
  );
  'source-unattached': { kind: 'off-piping'; reach: number } | { kind: 'shared'; system: string };
  'hydraulics-not-evaluated':
    | { kind: 'no-pipes'; layers: string[] }
    | { kind: 'no-source'; layers: string[] }
    | { kind: 'source-off-piping'; sources: number };
  'zone-unmatched': { zone: string; label: string | null; heads: number; hazard: Hazard };
  'head-unattached': { head: string; reach: number };
  'network-disconnected': { pipes: number; heads: string[] };
  'protection-area': { head: string; area: number; s: number; l: number; limit: number };
  'head-spacing-max': { head: string; next: string; distance: number; limit: number };
  'line-spacing-max': { line: string; distance: number; limit: number };
  'wall-distance-max': { head: string; distance: number; limit: number };
  'wall-distance-min': { head: string; distance: number; limit: number };
  'head-distance-min': { heads: string[]; least: number; limit: number };
  'head-duplicate': { head: string; drawn: number };
  'head-outside-room': { kind: 'head'; head: string } | { kind: 'no-rooms'; walls: boolean };
  'head-type-unchecked': { head: string; kind: 'sidewall' | 'extended-coverage' | 'other'; type: string };
  'head-k-factor': {
    heads: string[];
    k: number;
    attribute: string;
    system: 'us' | 'si';
    min: number;
    max: number;
    looksLike: string | null;
  };
  'design-area-size': { kind: 'area'; area: number; heads: number; required: number } | { kind: 'count'; heads: number; required: number };
  'design-area-length': { length: number; min: number };
  'design-area-not-remote': {
    heads: string[];
    bestPressure: number;
    bestFlow: number;
    drawnPressure: number;
    drawnFlow: number;
    place: string | null;
  };
  'supply-short':
    | { kind: 'no-supply' }
    | {
        kind: 'short' | 'low-margin';
        area: 'drawn' | 'most-demanding' | 'runner-up';
        place: string | null;
        pressure: number;
        demand: number;
        available: number;
        dryAt: number | null;
        margin: number;
      };
  'design-area-missing':
    | { kind: 'note'; note: string }
    | { kind: 'not-drawn' }
    | { kind: 'not-calculated'; source: 'drawn' | 'search'; note: string };
  'pipe-size-defaulted': { pipes: string[]; size: string; reach: number; unreadLabels: string[] };
  'network-topology': {
    system: string;
    systems: number;
    topology: 'tree' | 'loop' | 'grid';
    loops: number;
    lines: number;
    pipes: number;
  };
  'findings-not-listed': { rule: string; more: number; shown: number };
}

type Templates = { [K in FindingKind]: (p: FindingParams[K], fmt: Formatter) => string };

/** Ids as a message shows them: all of a few, the first six and a count of many. */
const listed = (ids: string[]) => (ids.length <= 8 ? ids.join(', ') : `${ids.slice(0, 6).join(', ')} and ${ids.length - 6} more`);
const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
const KIND_SAID = { sidewall: 'a sidewall head', 'extended-coverage': 'an extended-coverage head' } as const;
const AREA_SAID = {
  drawn: 'the drawn design area',
  'most-demanding': 'the most demanding area',
  'runner-up': 'the runner-up area',
} as const;

export const MESSAGES: Templates = {
  'config-units-header': (p) =>
    `the config says the drawing is in ${p.config} but its header ($INSUNITS) says ${p.header}: lengths were read in ${p.config}; remove "units" from the config if the header is right`,
  'config-units-mixed': (p) =>
    `"${p.key}" ${p.written} ${p.unit} is unusual for a design, ${p.written} ${p.otherUnit} is not: is "unitSystem": "${p.otherSystem}" meant, or the value written in the wrong unit?`,
  'design-basis-below-curve': (p, fmt) =>
    (p.zone === null ? '' : `zones "${p.zone}": `) +
    (p.kind === 'area'
      ? `the design area ${fmt.area(p.area)} is under the least area of the ${p.hazard} curve, ${fmt.area(p.minArea)} (its point: ${fmt.density(p.startDensity)} over ${fmt.area(p.minArea)})`
      : `the design density ${fmt.density(p.density)} over ${fmt.area(p.area)} is below the ${p.hazard} curve, which asks ${fmt.density(p.need)} at ${fmt.area(p.atArea)}`),
  'source-unattached': (p, fmt) =>
    p.kind === 'off-piping'
      ? `the water source is not on any pipe (nothing within ${fmt.length(p.reach)})`
      : `this water source is on the piping of the source ${p.system}: the system is calculated from ${p.system} alone`,
  'hydraulics-not-evaluated': (p) => {
    switch (p.kind) {
      case 'no-pipes':
        return `no hydraulic calculation: the drawing has no piping (pipe layers: ${p.layers.length ? p.layers.join(', ') : 'none found'}); the heads' spacing, coverage and walls are checked`;
      case 'no-source':
        return `no hydraulic calculation: no water source is drawn (source layers: ${p.layers.length ? p.layers.join(', ') : 'none found'}); draw the riser as a block or point and set "layers.source"`;
      case 'source-off-piping':
        return `no hydraulic calculation: ${p.sources === 1 ? 'the water source is' : `none of the ${p.sources} water sources is`} on a pipe`;
    }
  },
  'zone-unmatched': (p) =>
    p.label === null
      ? `zone ${p.zone} holds no label text: its ${plural(p.heads, 'head')} take the design basis (${p.hazard})`
      : `zone ${p.zone} "${p.label}" matches no pattern of "zones": its ${plural(p.heads, 'head')} take the design basis (${p.hazard})`,
  'head-unattached': (p, fmt) => `head ${p.head} is not on any pipe (nothing within ${fmt.short(p.reach)})`,
  'network-disconnected': (p) =>
    p.heads.length
      ? `${plural(p.pipes, 'pipe')} carrying ${plural(p.heads.length, 'head')} (${listed(p.heads)}) are not connected to the source`
      : `${plural(p.pipes, 'pipe')} not connected to the source (a crossing without a joint?)`,
  'protection-area': (p, fmt) =>
    `head ${p.head} protects ${fmt.area(p.area)} (S ${fmt.length(p.s)} × L ${fmt.length(p.l)}), over the ${fmt.area(p.limit)} allowed`,
  'head-spacing-max': (p, fmt) =>
    `heads ${p.head} and ${p.next} are ${fmt.length(p.distance)} apart on their branch line, over the ${fmt.length(p.limit)} allowed`,
  'line-spacing-max': (p, fmt) =>
    `branch line ${p.line} is ${fmt.length(p.distance)} from the next line, over the ${fmt.length(p.limit)} allowed`,
  'wall-distance-max': (p, fmt) => `head ${p.head} is ${fmt.length(p.distance)} from the wall, over the ${fmt.length(p.limit)} allowed`,
  'wall-distance-min': (p, fmt) => `head ${p.head} is ${fmt.short(p.distance)} from a wall, under the ${fmt.short(p.limit)} required`,
  'head-distance-min': (p, fmt) =>
    p.heads.length === 2
      ? `heads ${p.heads[0]} and ${p.heads[1]} are ${fmt.length(p.least)} apart, under the ${fmt.length(p.limit)} required`
      : `${p.heads.length} heads stand closer than ${fmt.length(p.limit)} to one another (${listed(p.heads)}); the closest are ${fmt.length(p.least)} apart`,
  'head-duplicate': (p) => `head ${p.head} is drawn ${p.drawn} times at one point: counted once`,
  'head-outside-room': (p) =>
    p.kind === 'head'
      ? `head ${p.head} is outside every room outline`
      : p.walls
        ? 'no closed room outlines on the wall layers: wall distances measured to wall linework'
        : 'no walls found: wall-distance and coverage checks at the room edges were skipped',
  'head-type-unchecked': (p) =>
    `head ${p.head} is ${p.kind === 'other' ? `of type "${p.type}"` : KIND_SAID[p.kind]}: check its spacing against its listing`,
  'head-k-factor': (p, fmt) => {
    const unit = p.system === 'si' ? 'L/min/bar½, as the config is SI' : 'gpm/psi½, as the config is US';
    const who = p.heads.length === 1 ? `head ${p.heads[0]} has` : `${p.heads.length} heads (${listed(p.heads)}) have`;
    return (
      `${who} ${fmt.kFactor(p.k)}, outside the listed ${fmt.kFactor(p.min)} to ${fmt.kFactor(p.max)} (the K attribute "${p.attribute}" is read in ${unit})` +
      `${p.looksLike ? `; it looks like a K in ${p.looksLike}` : ''}: check the head and the unit`
    );
  },
  'design-area-size': (p, fmt) =>
    p.kind === 'area'
      ? `the drawn design area covers ${fmt.area(p.area)} with ${plural(p.heads, 'head')}, under the ${fmt.area(p.required)} required`
      : `the drawn design area holds ${plural(p.heads, 'head')}, fewer than the ${p.required} required`,
  'design-area-length': (p, fmt) =>
    `the drawn design area is ${fmt.length(p.length)} along the branch lines, under 1.2·√A = ${fmt.length(p.min)}`,
  'design-area-not-remote': (p, fmt) =>
    `a more demanding area exists${p.place === null ? '' : ` in ${p.place}`} (heads ${listed(p.heads)}): it needs ${fmt.pressure(p.bestPressure)} at ${fmt.flow(p.bestFlow)} at the source, ` +
    `the drawn one ${fmt.pressure(p.drawnPressure)} at ${fmt.flow(p.drawnFlow)} (${fmt.pressure(p.bestPressure - p.drawnPressure)}, ${fmt.flow(p.bestFlow - p.drawnFlow)} more)`,
  'supply-short': (p, fmt) => {
    if (p.kind === 'no-supply') return 'no flow test given (config "supply"): the supply was not compared with the demand';
    const dry = p.dryAt !== null ? ` (its flow test reaches zero pressure at ${fmt.flow(p.dryAt)})` : '';
    const text = `${AREA_SAID[p.area]}${p.place === null ? '' : ` of ${p.place}`} needs ${fmt.pressure(p.pressure)} at ${fmt.flow(p.demand)} with hose streams; the supply gives ${fmt.pressure(p.available)}${dry}`;
    return p.kind === 'short' ? `${text}: short by ${fmt.pressure(-p.margin)}` : `${text}: a margin of only ${fmt.pressure(p.margin)}`;
  },
  'design-area-missing': (p) => {
    switch (p.kind) {
      case 'note':
        return p.note;
      case 'not-drawn':
        return 'no design area is drawn (a closed polyline on the design-area layer): only the searched area is reported';
      case 'not-calculated':
        return `a ${p.source} design area was not calculated: ${p.note}`;
    }
  },
  'pipe-size-defaulted': (p, fmt) =>
    `${p.pipes.length > 1 ? 'pipes' : 'pipe'} ${listed(p.pipes)} ${p.pipes.length > 1 ? 'have' : 'has'} no size label within ${fmt.length(p.reach)}; ${p.size}" assumed` +
    `${p.unreadLabels.length ? ` (beside it, ${p.unreadLabels.map((t) => `"${t}"`).join(', ')}, no nominal size)` : ''}`,
  'network-topology': (p) => {
    const form =
      p.topology === 'tree'
        ? 'a tree (one path from the source to each head)'
        : p.topology === 'grid'
          ? `a grid (branch lines fed from both ends; ${plural(p.loops, 'loop')})`
          : `looped (${plural(p.loops, 'loop')})`;
    const which = p.systems > 1 ? `the system fed from ${p.system}` : 'the piping';
    return `${which} is ${form}: ${plural(p.lines, 'branch line')}, ${plural(p.pipes, 'pipe')}`;
  },
  'findings-not-listed': (p) => `${p.more} more findings of ${p.rule} are not listed (the first ${p.shown} are)`,
};

/** A finding's message in the report's units. */
export function messageOf(f: Finding, fmt: Formatter): string {
  return (MESSAGES[f.rule] as (p: unknown, fmt: Formatter) => string)(f.params, fmt);
}
