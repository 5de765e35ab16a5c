// Hazard zones: closed outlines on the zone layers, named by the text inside, mapped by the config's `zones`
// patterns to a design basis and limits. Every head takes the zone it lies in; a head in no zone takes `design`.

import { compilePatterns } from '../config/patterns.js';
import type { Hazard, Settings } from '../config/settings.js';
import { containsPoint, signedArea } from '../geometry/polygon.js';
import { distance, type Point } from '../geometry/point.js';
import type { Head, Plan } from '../read/plan.js';
import { designBasis, type DesignBasis } from '../basis/design-basis.js';
import { resolveLimits, type Limits } from '../basis/limits.js';

/** What a head is checked and calculated against: a hazard's design basis and its limits. */
export interface Basis {
  hazard: Hazard;
  design: DesignBasis;
  limits: Limits;
}

export interface Zone extends Basis {
  id: string;
  /** The text inside the outline, whitespace joined to single spaces; null when it holds none. */
  label: string | null;
  handle: string;
  outline: Point[];
  /** The `zones` pattern the label matched; null when none did (the zone then takes `design`). */
  pattern: string | null;
  headIds: string[];
}

export interface Zoning {
  /** The configured `design`: heads in no zone, and zones whose label matches no pattern. */
  design: Basis;
  zones: Zone[];
  /** Zone id of each head that lies in a zone. */
  zoneOfHead: Map<string, string>;
}

/** The zones of a plan and the zone of each head. Zone outlines are read only where `zones` maps labels, or the layers are configured. */
export function zoneHeads(plan: Plan, settings: Settings): Zoning {
  const design = basisOf(settings, settings.design.hazard, settings.design);
  const zoning: Zoning = { design, zones: [], zoneOfHead: new Map() };
  const patterns = Object.entries(settings.zones);
  if (patterns.length === 0 && plan.roles.zones.from !== 'config') return zoning;
  const outlines = plan.zones
    .map((o) => ({ o, area: Math.abs(signedArea(o.points)) }))
    .filter((z) => z.area > 0)
    .sort((a, b) => a.area - b.area);
  const matchers = patterns.map(([pattern, basis]) => ({ pattern, basis, test: compilePatterns([pattern]) }));
  zoning.zones = outlines.map(({ o }, k): Zone => {
    // A nested zone's text belongs to the nested zone (outlines are in order of size, smallest first).
    const smaller = outlines.slice(0, k).map((z) => z.o.points);
    const label = labelOf(
      o.points,
      plan.zoneTexts.filter((t) => containsPoint(o.points, t.position) && !smaller.some((p) => containsPoint(p, t.position))),
    );
    const match = label === null ? undefined : matchers.find((m) => m.test(label));
    const basis = match ? basisOf(settings, match.basis.hazard, match.basis) : design;
    return { id: `Z${k + 1}`, label, handle: o.handle, outline: o.points, pattern: match?.pattern ?? null, headIds: [], ...basis };
  });
  for (const head of plan.heads) {
    const zone = zoning.zones.find((z) => containsPoint(z.outline, head.position));
    if (!zone) continue;
    zone.headIds.push(head.id);
    zoning.zoneOfHead.set(head.id, zone.id);
  }
  return zoning;
}

/** The basis a head is checked against: its zone's, else the configured design. */
export function basisOfHead(zoning: Zoning, head: Pick<Head, 'id'>): Basis {
  const id = zoning.zoneOfHead.get(head.id);
  return id === undefined ? zoning.design : zoning.zones.find((z) => z.id === id)!;
}

/** A zone's basis: its hazard, density and area over the configured design (system type, ceiling, heads). */
function basisOf(settings: Settings, hazard: Hazard, given: { density?: number | undefined; area?: number | undefined }): Basis {
  const own = given === settings.design;
  const design = designBasis({
    ...settings.design,
    hazard,
    density: given.density,
    area: given.area,
    // The hose allowance follows the zone's hazard unless the design's own is meant.
    hoseAllowance: own ? settings.design.hoseAllowance : undefined,
  });
  return { hazard, design, limits: resolveLimits(hazard, given.density, settings.limits) };
}

/** The zone's label: the tallest text inside, the one nearest the middle among equals. */
function labelOf(outline: Point[], texts: { text: string; height: number; position: Point }[]): string | null {
  const centre = {
    x: outline.reduce((s, p) => s + p.x, 0) / outline.length,
    y: outline.reduce((s, p) => s + p.y, 0) / outline.length,
  };
  const named = texts.map((t) => ({ ...t, text: t.text.replace(/\s+/g, ' ').trim() })).filter((t) => t.text !== '');
  named.sort((a, b) => b.height - a.height || distance(a.position, centre) - distance(b.position, centre));
  return named[0]?.text ?? null;
}
