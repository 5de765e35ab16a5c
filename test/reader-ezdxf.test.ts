// The reader and network stages on drawings written by an independent program: Debian's ezdxf wrote
// fixtures/bay2-*.dxf (R12, R2000, R2018) and computed the ground truth in fixtures/bay2.truth.json.

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS, parseSettings } from '../src/config/settings.js';
import { buildNetwork } from '../src/network/build-network.js';
import { planFromDrawing } from '../src/read/plan.js';
import { readDrawing } from '../src/read/read-drawing.js';

const truth = JSON.parse(readFileSync('fixtures/bay2.truth.json', 'utf8'));
const settings = parseSettings({ layers: { heads: ['FP-HEAD'], pipes: ['FP-PIPE'], walls: ['A-WALL'], source: ['FP-SOURCE'] } });

describe.each(['R12', 'R2000', 'R2018'])('ezdxf-written %s drawing', (version) => {
  const t = truth.versions[version];
  const bytes = new Uint8Array(readFileSync(`fixtures/${t.file}`));
  const drawing = readDrawing(bytes, { layers: settings.layers, ...(version === 'R12' ? { units: 'in' as const } : {}) });
  const plan = planFromDrawing(drawing, settings);
  const network = buildNetwork(plan, settings);

  it("is a clean file by ezdxf's own audit (recorded when written)", () => {
    expect(t.auditErrors).toBe(0);
    expect(drawing.version).toBe(t.acadver);
  });

  it('finds every head with its handle and world position (ezdxf ground truth)', () => {
    expect(plan.heads).toHaveLength(t.heads.length);
    const got = [...plan.heads].sort((a, b) => a.position.y - b.position.y || a.position.x - b.position.x);
    t.heads.forEach((h: { handle: string; x: number; y: number; attributes: Record<string, string> }, i: number) => {
      expect(got[i]!.handle).toBe(h.handle);
      expect(got[i]!.position.x).toBeCloseTo(h.x, 9);
      expect(got[i]!.position.y).toBeCloseTo(h.y, 9);
      expect(got[i]!.attributes['K']).toBe(h.attributes['K']);
    });
  });

  it('reads K and ELEV attributes over the defaults', () => {
    const k8 = plan.heads.filter((h) => h.kFactor === 8);
    expect(k8.map((h) => [h.position.x, h.position.y])).toEqual([[42, 5]]);
    const high = plan.heads.filter((h) => h.elevation === 14);
    expect(high.map((h) => [h.position.x, h.position.y])).toEqual([[42, 15]]);
    expect(plan.heads.filter((h) => h.elevation === DEFAULT_SETTINGS.defaults.headElevation)).toHaveLength(12);
  });

  it('keeps non-ASCII layer names and texts (code page or UTF-8)', () => {
    expect(drawing.layers.map((l) => l.name)).toContain('A-ANNO-\u00d8');
    expect(drawing.texts.map((x) => x.text)).toContain('2\u00bd"');
    // a note is no size label and is not read, unless its layer plays a role
    expect(drawing.texts.map((x) => x.text)).not.toContain('\u00d8 25 \u2013 Hinweis');
    const notes = readDrawing(bytes, {
      layers: { ...settings.layers, designArea: ['A-ANNO-*'] },
      ...(version === 'R12' ? { units: 'in' as const } : {}),
    });
    expect(notes.texts.map((x) => x.text)).toContain('\u00d8 25 \u2013 Hinweis');
  });

  it('rebuilds one network from the source: feed main, cross main, three branch lines of four heads', () => {
    expect(network.systems).toHaveLength(1);
    expect(network.systems[0]!.topology).toBe('tree');
    expect(network.branchLines.map((b) => b.headIds.length)).toEqual([4, 4, 4]);
    const roles = network.pipes.map((p) => p.role);
    expect(roles.filter((r) => r === 'feed-main')).toHaveLength(1);
    expect(roles.filter((r) => r === 'cross-main')).toHaveLength(2);
    const feed = network.pipes.find((p) => p.role === 'feed-main')!;
    expect(feed.nominalSize).toBe('2-1/2');
    expect(feed.length).toBeCloseTo(12, 9);
    expect(network.pipes.filter((p) => p.role === 'cross-main').every((p) => p.nominalSize === '2')).toBe(true);
    // Line 1 labelled 1-1/4" (a LINE), line 2 labelled 1 1/4" (a polyline), line 3 labelled 1".
    const lineSizes = network.branchLines.map((b) => new Set(b.pipeIds.map((id) => network.pipes.find((p) => p.id === id)!.nominalSize)));
    expect(lineSizes.map((s) => [...s])).toEqual([['1-1/4'], ['1-1/4'], ['1']]);
  });

  it('reports the head on no pipe and the crossing pipe as not connected', () => {
    const lone = plan.heads.find((h) => h.position.x === 40 && h.position.y === 10)!;
    expect(network.unattachedHeadIds).toEqual([lone.id]);
    expect(network.disconnected).toHaveLength(1);
    expect(network.disconnected[0]!.headIds).toEqual([]);
    expect(network.pipes.filter((p) => p.sizeFrom === 'default')).toHaveLength(1);
  });
});

describe('block expansion against ezdxf (fixtures/transforms.dxf)', () => {
  it('places every nested, rotated, mirrored, scaled and arrayed reference where ezdxf does', () => {
    const t = truth.transforms;
    const drawing = readDrawing(new Uint8Array(readFileSync(`fixtures/${t.file}`)));
    const got = drawing.refs.filter((r) => r.block === 'HD').sort((a, b) => a.position.x - b.position.x || a.position.y - b.position.y);
    expect(got).toHaveLength(t.heads.length);
    t.heads.forEach((h: { handle: string; x: number; y: number }, i: number) => {
      expect(got[i]!.position.x).toBeCloseTo(h.x, 9);
      expect(got[i]!.position.y).toBeCloseTo(h.y, 9);
      expect(got[i]!.handle).toBe(h.handle);
    });
  });
});
