// Real DWG drawings (../shared/real-dwg: 33 samples, R13 to 2018, from public CAD libraries' test data, 27 with a DXF
// twin of the same drawing) read through LibreDWG: each twin's layers, entity counts, handles, positions and polyline
// vertices equal ezdxf's reading of the twin but for the losses named here; every sample ends in exit 0, 1 or 2 with
// one line within the limits; a DWG's annotated DXF keeps its handles, passes ezdxf's audit and renders in LibreCAD.

import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { runCorpus } from '../scripts/corpus.js';
import { dwgAsDxfHere } from '../src/io/dwg.js';
import { readerEntities, type ListedEntity } from './support/drawing-entities.js';
import { expectSoundRuns } from './support/corpus.js';
import { describeWith, hasEzdxf, SYSTEM_PYTHON } from './support/external.js';
import { canRender, inkShare, renderPdf } from './support/render.js';

const ROOT = '../shared/real-dwg';
const LIMITS = { seconds: 60, memoryMB: 2048 };

/** What `check` ends in for every sample, with no config: none is a sprinkler layout. */
const OUTCOMES: Record<string, string> = {
  '2000_TS1.dwg': 'no heads',
  '2000_entities-2d.dwg': 'no heads',
  '2004_HatchG.dwg': 'no heads',
  '2004_material.dwg': 'no heads',
  '2007_ATMOS-DC22S.dwg': 'no heads',
  '2007_Polyline.dwg': 'no heads',
  '2007_Text.dwg': 'no heads',
  '2007_circle.dwg': 'no heads',
  '2010_gh209_1.dwg': 'no heads',
  '2013_gh109_1.dwg': 'no unit',
  // 38 alike symbols on one layer are taken for heads, with their lines as pipes: a check that finds 25 errors.
  '2013_gh44-error.dwg': 'checked 1',
  '2018_Dynblocks.dwg': 'no heads',
  '2018_Leader.dwg': 'no heads',
  '2018_LiveSection1.dwg': 'no heads',
  'acs_AC1014.dwg': 'no unit',
  'acs_AC1015.dwg': 'no heads',
  'acs_AC1018.dwg': 'no heads',
  'acs_AC1021.dwg': 'no heads',
  'acs_AC1024.dwg': 'no heads',
  'acs_AC1027.dwg': 'no heads',
  'acs_AC1032.dwg': 'no heads',
  'example_2000.dwg': 'no heads',
  // LibreDWG stops on this file (a table index out of bounds); headcheck says so in one line.
  'example_2004.dwg': 'unreadable',
  'example_2007.dwg': 'no heads',
  'example_2010.dwg': 'no heads',
  'example_2013.dwg': 'no heads',
  'example_2018.dwg': 'no heads',
  'example_r13.dwg': 'no unit',
  'example_r14.dwg': 'no unit',
  'r14_Leader.dwg': 'no unit',
  'r14_v.dwg': 'no unit',
  'sample_2000.dwg': 'no heads',
  'sample_2018.dwg': 'no heads',
};

function outcome(code: number | null, message: string): string {
  if (code === 0 || code === 1) return `checked ${code}`;
  if (/does not state its length unit/.test(message)) return 'no unit';
  if (/no sprinkler heads found/.test(message)) return 'no heads';
  if (/the DWG could not be read/.test(message)) return 'unreadable';
  return `exit ${code}: ${message}`;
}

/**
 * The reader's documented losses against the twin: per drawing, the count differences "TYPE@layer: ours/twin's" and
 * the layers only one side has ("NAME+" ours only, "NAME-" the twin's only). Anything else is a failure.
 */
const LOSSES: Record<string, { counts?: string[]; layers?: string[] }> = {
  // The twins were saved by a program that adds the Defpoints layer (dimension definition points) on saving;
  // LibreDWG writes only the DWG's own layer table.
  '2004_material.dwg': { layers: ['Defpoints-'] },
  '2007_Polyline.dwg': { layers: ['Defpoints-'] },
  '2007_Text.dwg': { layers: ['Defpoints-'] },
  '2007_circle.dwg': { layers: ['Defpoints-'] },
  '2010_gh209_1.dwg': { layers: ['Defpoints-'] },
  'r14_Leader.dwg': { layers: ['Defpoints-'], counts: ['ACAD_PROXY_ENTITY@0: 0/1'] },
  'sample_2000.dwg': { layers: ['Defpoints-'] },
  'sample_2018.dwg': { layers: ['Defpoints-'] },
  // The twin's leader sits on a layer "0 @ 1" its writer made; LibreDWG puts it on layer 0.
  '2018_Leader.dwg': { layers: ['0 @ 1-', 'Defpoints-'], counts: ['LEADER@0 @ 1: 0/1', 'LEADER@0: 1/0'] },
  // Proxy entities (objects of an add-on program kept as opaque graphics): LibreDWG's DXF leaves them out.
  '2013_gh109_1.dwg': {
    counts: [
      'ACAD_PROXY_ENTITY@0: 0/2',
      'ACAD_PROXY_ENTITY@AXIS: 0/3',
      'ACAD_PROXY_ENTITY@COLUMN: 0/3',
      'ACAD_PROXY_ENTITY@STAIR: 0/1',
      'ACAD_PROXY_ENTITY@WALL: 0/9',
      'ACAD_PROXY_ENTITY@WINDOW: 0/7',
    ],
  },
  // In this 2004 file LibreDWG's DXF leaves out meshes, a wipeout, tables, multileaders, an image and an underlay.
  'acs_AC1018.dwg': {
    counts: [
      'ACAD_TABLE@*: 0/2',
      'IMAGE@0: 0/1',
      'MESH@0: 0/1',
      'MESH@Layer_color_80: 0/1',
      'MULTILEADER@0: 0/15',
      'PDFUNDERLAY@0: 0/1',
      'WIPEOUT@0: 0/1',
    ],
  },
  // R13/R14: the references to two anonymous blocks (*X18, *T14: a table's graphics) and the wipeouts are left out.
  'example_r13.dwg': { counts: ['INSERT@TAVOLO_3: 12/14', 'WIPEOUT@TAVOLO_3: 0/2'] },
  'example_r14.dwg': { counts: ['ACAD_PROXY_ENTITY@TAVOLO_3: 0/1', 'INSERT@TAVOLO_3: 10/12', 'WIPEOUT@TAVOLO_3: 0/2'] },
};

interface EzdxfEntity extends Omit<ListedEntity, 'layer'> {
  /** null where ezdxf 0.18 keeps the type without its layer (ACAD_TABLE). */
  layer: string | null;
}

function ezdxfEntities(dxf: string): { layers: string[]; entities: EzdxfEntity[] } {
  const r = spawnSync(SYSTEM_PYTHON, ['scripts/ezdxf-entities.py', dxf], { encoding: 'utf8', maxBuffer: 1 << 28, timeout: 120_000 });
  expect(r.status, r.stderr).toBe(0);
  return JSON.parse(r.stdout);
}

/**
 * Count differences "TYPE@layer: ours/theirs". A type ezdxf 0.18 keeps without its layer (ACAD_TABLE) is counted
 * by type alone on both sides, as "TYPE@*".
 */
function countDifferences(ours: ListedEntity[], theirs: EzdxfEntity[]): string[] {
  const layerless = new Set(theirs.filter((e) => e.layer === null).map((e) => e.type));
  const key = (e: { type: string; layer: string | null }) => `${e.type}@${layerless.has(e.type) ? '*' : e.layer}`;
  const tally = (entities: { type: string; layer: string | null }[]) => {
    const m = new Map<string, number>();
    for (const e of entities) m.set(key(e), (m.get(key(e)) ?? 0) + 1);
    return m;
  };
  const a = tally(ours);
  const b = tally(theirs);
  return [...new Set([...a.keys(), ...b.keys()])]
    .filter((k) => a.get(k) !== b.get(k))
    .map((k) => `${k}: ${a.get(k) ?? 0}/${b.get(k) ?? 0}`)
    .sort();
}

const twins = existsSync(ROOT)
  ? readdirSync(ROOT)
      .filter((f) => f.endsWith('.dwg') && existsSync(join(ROOT, f.replace(/\.dwg$/, '.dxf'))))
      .sort()
  : [];

describeWith('../shared/real-dwg (the DWG samples)', existsSync(ROOT), 'real DWG drawings', () => {
  it('every sample through layers and check: one line, exit 0-2, within 60 s and 1 GiB, the recorded outcome', async () => {
    const rows = await runCorpus(ROOT, { timeoutS: 90, extensions: ['.dwg'] });
    expect(rows.map((r) => r.file)).toEqual(Object.keys(OUTCOMES).sort());
    for (const r of rows) {
      expectSoundRuns(r);
      expect(outcome(r.check.code, r.check.message), r.file).toBe(OUTCOMES[r.file]);
    }
  }, 600_000);

  describeWith('python3-ezdxf', hasEzdxf(), 'against ezdxf reading the DXF twin', () => {
    it.each(twins)(
      '%s: layers, counts, handles, positions and vertices but for the named losses',
      async (file) => {
        const bytes = new Uint8Array(readFileSync(join(ROOT, file)));
        if (OUTCOMES[file] === 'unreadable') {
          await expect(dwgAsDxfHere(bytes, LIMITS)).rejects.toThrow(/could not be read/);
          return;
        }
        const ours = readerEntities(await dwgAsDxfHere(bytes, LIMITS));
        const theirs = ezdxfEntities(join(ROOT, file.replace(/\.dwg$/, '.dxf')));
        const loss = LOSSES[file] ?? {};
        const layerDifferences = [...new Set([...ours.layers, ...theirs.layers])]
          .filter((l) => ours.layers.includes(l) !== theirs.layers.includes(l))
          .map((l) => `${l}${ours.layers.includes(l) ? '+' : '-'}`)
          .sort();
        expect(layerDifferences).toEqual(loss.layers ?? []);
        expect(countDifferences(ours.entities, theirs.entities)).toEqual(loss.counts ?? []);
        // Every entity the reader decodes is in the twin under the same handle, type, point and vertex count.
        const twin = new Map(theirs.entities.map((e) => [e.handle, e]));
        for (const e of ours.entities.filter((x) => x.handle)) {
          const t = twin.get(e.handle);
          expect(t, `${file} ${e.type} ${e.handle}`).toBeDefined();
          expect(t!.type).toBe(e.type);
          expect(e.vertices, `${file} ${e.handle}`).toBe(t!.vertices);
          // ezdxf's listing gives points for the common types only (scripts/ezdxf-entities.py).
          if (e.at && t!.at) {
            const scale = Math.max(1, Math.hypot(t!.at[0], t!.at[1]));
            expect(Math.hypot(e.at[0] - t!.at[0], e.at[1] - t!.at[1]) / scale, `${file} ${e.handle}`).toBeLessThan(1e-9);
          }
        }
      },
      120_000,
    );
  });
});

/** `check` of a DWG with `--dxf` (the corpus's config that takes example_2000's table symbols for heads), and the
 * DWG as plain DXF beside it; the folder holding both. */
async function annotatedDwg(): Promise<string> {
  const dir = mkdtempSync(join(tmpdir(), 'hc-dwg-'));
  const drawing = join(ROOT, 'example_2000.dwg');
  const config = '../shared/real-dxf/configs/roles/LibreDWG-libredwg__example_2000.dxf.json';
  const args = ['bin/headcheck.js', 'check', drawing, '--config', config, '--dxf', join(dir, 'annotated.dxf'), '--quiet'];
  const r = spawnSync(process.execPath, args, { encoding: 'utf8', timeout: 120_000 });
  expect(r.status, r.stderr).toBe(1);
  writeFileSync(join(dir, 'plain.dxf'), await dwgAsDxfHere(new Uint8Array(readFileSync(drawing)), LIMITS));
  return dir;
}

describeWith('../shared/real-dwg and python3-ezdxf', existsSync(ROOT) && hasEzdxf(), 'the annotated DXF of a DWG', () => {
  it('keeps every handle of the DWG, adds the annotations, and passes ezdxf audit', async () => {
    const dir = await annotatedDwg();
    const r = spawnSync(SYSTEM_PYTHON, ['scripts/ezdxf-audit.py', join(dir, 'annotated.dxf')], { encoding: 'utf8', timeout: 120_000 });
    expect(r.status, r.stderr).toBe(0);
    const audit = JSON.parse(r.stdout);
    expect(audit.readError).toBeUndefined();
    expect(audit.errors).toEqual([]);
    expect(audit.fixes).toEqual([]);
    expect(audit.dxfversion).toBe('AC1015');
    expect(audit.hcEntities).toBeGreaterThan(20);
    const drawn = readerEntities(new Uint8Array(readFileSync(join(dir, 'plain.dxf'))));
    const kept = new Set<string>(audit.handles);
    for (const e of drawn.entities.filter((x) => x.handle)) expect(kept.has(e.handle), e.handle).toBe(true);
  }, 180_000);
});

describeWith('../shared/real-dwg, librecad and poppler-utils', existsSync(ROOT) && canRender(), 'the annotated DWG in LibreCAD', () => {
  it('dxf2pdf renders it as it renders the DWG itself', async () => {
    const dir = await annotatedDwg();
    // The legend widens the extents dxf2pdf fits to the page, so the drawing's own ink may shrink: both must show.
    expect(inkShare(renderPdf(dir, 'plain'))).toBeGreaterThan(0.001);
    expect(inkShare(renderPdf(dir, 'annotated'))).toBeGreaterThan(0.001);
  }, 180_000);
});
