// The design-area stage: per system, and per hazard zone within it, the most demanding area and its runner-up;
// and the designer's drawn areas; each with its shape figures and a full hydraulic calculation.

import type { Settings } from '../config/settings.js';
import { dot, type Point } from '../geometry/point.js';
import type { AreaHydraulics } from '../hydraulics/calculate.js';
import { calculateArea } from '../hydraulics/calculate.js';
import type { FlowingHead } from '../hydraulics/model.js';
import type { NetSystem, Network } from '../network/types.js';
import type { Head, Plan } from '../read/plan.js';
import type { Outline } from '../read/types.js';
import type { Coverage } from '../coverage/coverage.js';
import { basisOfHead, type Zoning } from '../zones/zones.js';
import { containsPoint, signedArea } from '../geometry/polygon.js';
import { floorOf } from './floor.js';
import { candidateGroupsOf, lineFamilies, type LineFamily } from './candidates.js';
import type { DesignBasis } from '../basis/design-basis.js';
import { searchMostDemanding, type SearchOutcome } from './search.js';
import type { AreaShape } from './shape.js';
import { maxOf, minOf } from '../arrays.js';

export interface DesignAreaResult {
  source: 'drawn' | 'search';
  /** For searched areas: the most demanding one, or the runner-up. */
  rank: 'most-demanding' | 'runner-up' | null;
  /** The system (its source's handle) and the zone (its id) the area belongs to; null where it has none. */
  system: string | null;
  zone: string | null;
  /** How findings name the area's system and zone, where the drawing has more than one of them; else null. */
  place: string | null;
  /** The design basis the area is calculated with, and the shape it must have. */
  basis: DesignBasis;
  shape: AreaShape | null;
  headIds: string[];
  lineIds: string[];
  /**
   * Length along the branch lines (a searched area's longest run on one line; a drawn outline's extent), width
   * across them, ft; the floor its heads protect (each head's cell half-way to its neighbours, or to the wall),
   * ft², which a searched outline encloses; and the sum of the heads' S × L, ft², the standard's count.
   */
  length: number;
  width: number;
  actualArea: number;
  coveredArea: number;
  /** Area of the drawn outline, ft² (drawn areas only). */
  outlineArea: number | null;
  /** The outline's rings: a searched area whose leftover heads lie apart from its rectangle has two. */
  outline: Point[][];
  /** Where findings about the area are marked: a corner of its outline. */
  at: Point;
  handle: string | null;
  hydraulics: AreaHydraulics | null;
  /** What the reviewer should know of the area: why hydraulics are missing, or that the whole system flows. */
  note: string | null;
}

export type SearchStats = Omit<SearchOutcome, 'best' | 'runnerUp'>;

/** One design-area search: the heads of one system within one zone (or outside every zone). */
export interface AreaGroup {
  system: string;
  zone: string | null;
  basis: DesignBasis;
  headIds: string[];
  shape: AreaShape | null;
  /** Head spacing along the lines, ft. */
  spacing: number | null;
  search: SearchStats | null;
}

export interface DesignAreas {
  groups: AreaGroup[];
  areas: DesignAreaResult[];
  drawnCount: number;
  notes: string[];
}

export function evaluateDesignAreas(
  plan: Plan,
  network: Network,
  coverage: Map<string, Coverage>,
  zoning: Zoning,
  settings: Settings,
  roomOf: (p: Point) => Outline | null,
  onGarbage?: () => void,
): DesignAreas {
  const headById = new Map(plan.heads.map((h) => [h.id, h]));
  const basisOf = (id: string) => basisOfHead(zoning, { id });
  const areaOf = (id: string) => coverage.get(id)?.area ?? basisOf(id).limits.maxArea;
  // Each head delivers its own zone's density over its own protection area.
  const flowingOf = (ids: string[]): FlowingHead[] =>
    ids.map((id) => {
      const head = headById.get(id)!;
      const density = basisOf(id).design.density;
      return { head, required: Math.max(settings.design.minHeadPressure, ((density * areaOf(id)) / head.kFactor) ** 2) };
    });
  const systemOfNode = new Map(network.systems.flatMap((s) => s.nodeIds.map((n) => [n, s] as const)));
  const systemOf = (id: string) => {
    const node = network.headNode[id];
    return node === undefined ? undefined : systemOfNode.get(node);
  };
  // Each group with the family of parallel lines its search runs on.
  const groups = groupsOf(network, zoning).map((g) => ({ ...g, fam: mainFamily(network, g, plan, coverage) }));
  const out: DesignAreas = { groups: [], areas: [], drawnCount: plan.designAreas.length, notes: [] };
  const mode = settings.design.areaMode;
  const measuring: Measuring = { headById, coverage, areaOf, roomOf };

  if (mode !== 'search') {
    for (const outline of plan.designAreas) {
      const ids = plan.heads.filter((h) => containsPoint(outline.points, h.position)).map((h) => h.id);
      const system = mostCommon(ids.map((id) => systemOf(id)?.id ?? null));
      const zone = mostCommon(ids.map((id) => zoning.zoneOfHead.get(id) ?? null));
      const group = groups.find((g) => g.system.id === system && g.zone === zone);
      const basis = group?.basis ?? (ids.length ? basisOf(ids[0]!).design : zoning.design.design);
      const fam = group?.fam ?? null;
      const fed = ids.filter((id) => systemOf(id)?.id === system);
      let hydraulics: AreaHydraulics | null = null;
      let note: string | null = null;
      if (system === null || fed.length === 0) note = 'no head of the area is on piping fed from a source';
      else {
        try {
          hydraulics = calculateArea(network, systemOfId(network, system).sourceNodeId, flowingOf(fed), settings, basis.hoseAllowance);
          if (fed.length < ids.length) note = 'heads not on the piping of its source were left out';
        } catch (err) {
          note = err instanceof Error ? err.message : String(err);
        }
      }
      out.areas.push({
        ...measureDrawn(outline, ids, fam, zoning.design.limits.maxArea, network, measuring),
        rank: null,
        system,
        zone,
        place: null,
        basis,
        shape: fam?.shape ?? null,
        hydraulics,
        note,
      });
    }
  }

  for (const group of groups) {
    const { fam } = group;
    const stats: AreaGroup = {
      system: group.system.id,
      zone: group.zone,
      basis: group.basis,
      headIds: group.headIds,
      shape: fam?.shape ?? null,
      spacing: fam?.spacing ?? null,
      search: null,
    };
    out.groups.push(stats);
    if (mode === 'drawn') continue;
    const name = groupName(group, zoning);
    if (!fam) {
      out.notes.push(`no branch lines with heads in ${name}: the design area could not be searched`);
      continue;
    }
    const place = { system: group.system.id, zone: group.zone, basis: group.basis, shape: fam.shape, place: null };
    const source = group.system.sourceNodeId;
    const total = group.headIds.reduce((s, id) => s + areaOf(id), 0);
    if (group.headIds.length < fam.shape.totalHeads || total < group.basis.area - 1e-6) {
      // A design area larger than the system (or zone): every head of it flows.
      try {
        const hydraulics = calculateArea(network, source, flowingOf(group.headIds), settings, group.basis.hoseAllowance);
        out.areas.push({
          ...measureSearched(
            group.headIds,
            fam.lines.map((l) => l.id),
            fam,
            measuring,
          ),
          ...place,
          rank: 'most-demanding',
          hydraulics,
          note: `the design area (${round(group.basis.area)} ft²) is larger than ${name} (${group.headIds.length} heads, ${round(total)} ft²): every head flows`,
        });
      } catch (err) {
        out.notes.push(`design-area calculation failed in ${name}: ${err instanceof Error ? err.message : String(err)}`);
      }
      continue;
    }
    try {
      const candidates = candidateGroupsOf(fam, areaOf, group.basis.area);
      const found = searchMostDemanding(network, source, candidates, flowingOf, settings, group.basis.hoseAllowance, { onGarbage });
      stats.search = {
        candidates: found.candidates,
        evaluated: found.evaluated,
        screened: found.screened,
        solves: found.solves,
        pruned: found.pruned,
      };
      for (const [rank, s] of [
        ['most-demanding', found.best],
        ['runner-up', found.runnerUp],
      ] as const) {
        if (!s) continue;
        out.areas.push({
          ...measureSearched(s.candidate.headIds, s.candidate.lineIds, fam, measuring),
          ...place,
          rank,
          hydraulics: s.hydraulics,
          note: null,
        });
      }
    } catch (err) {
      out.notes.push(`design-area search failed in ${name}: ${err instanceof Error ? err.message : String(err)}`);
    }
  }
  const several = out.groups.length > 1;
  for (const a of out.areas) {
    const system = network.systems.find((x) => x.id === a.system);
    a.place = several && system ? groupName({ system, zone: a.zone }, zoning) : null;
  }
  return out;
}

/** The heads of each system, split by zone: one design-area search each. */
function groupsOf(network: Network, zoning: Zoning): { system: NetSystem; zone: string | null; basis: DesignBasis; headIds: string[] }[] {
  return network.systems.flatMap((system) => {
    const byZone = new Map<string | null, string[]>();
    for (const id of system.headIds) {
      const zone = zoning.zoneOfHead.get(id) ?? null;
      const list = byZone.get(zone);
      if (list) list.push(id);
      else byZone.set(zone, [id]);
    }
    return [...byZone.entries()].map(([zone, headIds]) => ({
      system,
      zone,
      basis: basisOfHead(zoning, { id: headIds[0]! }).design,
      headIds,
    }));
  });
}

/** How notes name a group: the system fed from a source, or a zone of it. */
function groupName(group: { system: NetSystem; zone: string | null }, zoning: Zoning): string {
  const zone = group.zone === null ? null : zoning.zones.find((z) => z.id === group.zone)!;
  return zone ? `the zone ${zone.label ?? zone.id} of system ${group.system.id}` : `the system fed from ${group.system.id}`;
}

/** The family of parallel branch lines that holds most of a group's lines, its lines cut to the group's heads. */
function mainFamily(
  network: Network,
  group: { system: NetSystem; basis: DesignBasis; headIds: string[] },
  plan: Plan,
  coverage: Map<string, Coverage>,
): LineFamily | null {
  const own = new Set(group.headIds);
  const inSystem = new Set(group.system.branchLineIds);
  const lines = network.branchLines
    .filter((b) => inSystem.has(b.id))
    .map((b) => ({ ...b, headIds: b.headIds.filter((id) => own.has(id)) }))
    .filter((b) => b.headIds.length > 0);
  const families = lineFamilies(network, lines, plan.heads, coverage, group.basis.area);
  return families.sort((a, b) => b.lines.length - a.lines.length)[0] ?? null;
}

function systemOfId(network: Network, id: string): NetSystem {
  return network.systems.find((s) => s.id === id)!;
}

/** The most frequent value of a list (the first seen among equals), or null for an empty list. */
function mostCommon<T>(xs: (T | null)[]): T | null {
  const counts = new Map<T | null, number>();
  for (const x of xs) counts.set(x, (counts.get(x) ?? 0) + 1);
  let best: T | null = null;
  let most = 0;
  for (const [x, n] of counts) {
    if (n > most) {
      best = x;
      most = n;
    }
  }
  return best;
}

const round = (x: number) => Math.round(x);

type Measured = Omit<DesignAreaResult, 'hydraulics' | 'note' | 'rank' | 'system' | 'zone' | 'basis' | 'shape' | 'place'>;

/** What measures an area: the heads, their coverage, the room they are in and the frame of the lines. */
interface Measuring {
  headById: Map<string, Head>;
  coverage: Map<string, Coverage>;
  areaOf: (id: string) => number;
  roomOf: (p: Point) => Outline | null;
}

/** The half-spacings a head's cell takes where it has neither a neighbour nor a wall in reach. */
const fallbackOf = (fam: LineFamily | null, maxArea: number) =>
  fam
    ? { along: fam.spacing / 2, across: fam.perHead / fam.spacing / 2 }
    : { along: Math.sqrt(maxArea) / 2, across: Math.sqrt(maxArea) / 2 };

function measureSearched(ids: string[], lineIds: string[], fam: LineFamily, m: Measuring): Measured {
  const floor = floorOf(
    ids.map((id) => m.headById.get(id)!),
    m.coverage,
    fam,
    m.roomOf,
    fallbackOf(fam, 0),
  );
  return {
    source: 'search',
    headIds: ids,
    lineIds,
    handle: null,
    outline: floor.outline,
    at: floor.outline[0]?.[0] ?? m.headById.get(ids[0]!)!.position,
    outlineArea: null,
    length: floor.length,
    width: floor.width,
    actualArea: floor.area,
    coveredArea: ids.reduce((s, id) => s + m.areaOf(id), 0),
  };
}

function measureDrawn(outline: Outline, ids: string[], fam: LineFamily | null, maxArea: number, network: Network, m: Measuring): Measured {
  const frame = fam ?? { u: { x: 1, y: 0 }, v: { x: 0, y: 1 } };
  const ts = outline.points.map((p) => dot(p, frame.u));
  const os = outline.points.map((p) => dot(p, frame.v));
  const lineIds = network.branchLines.filter((b) => b.headIds.some((h) => ids.includes(h))).map((b) => b.id);
  const floor = floorOf(
    ids.map((id) => m.headById.get(id)!),
    m.coverage,
    frame,
    m.roomOf,
    fallbackOf(fam, maxArea),
  );
  return {
    source: 'drawn',
    headIds: ids,
    lineIds,
    handle: outline.handle,
    outline: [outline.points],
    at: outline.points[0]!,
    outlineArea: Math.abs(signedArea(outline.points)),
    length: maxOf(ts) - minOf(ts),
    width: maxOf(os) - minOf(os),
    actualArea: floor.area,
    coveredArea: ids.reduce((s, id) => s + m.areaOf(id), 0),
  };
}
