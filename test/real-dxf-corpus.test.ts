// The real-drawing corpus (../shared/real-dxf: 60 DXF files from public CAD libraries and people's own drawings,
// none of them a sprinkler layout) through `layers` and `check`, each in a process of its own: every file ends in
// exit 0, 1 or 2 with one line, within 60 s and 1 GiB, and in the outcome recorded here; a change is deliberate.
// ezdxf reads all but the binary ones and recover01 (which it reads in recover mode): headcheck calls none broken.

import { existsSync } from 'node:fs';
import { expect, it } from 'vitest';
import { runCorpus, type CorpusRow, type CorpusRun } from '../scripts/corpus.js';
import { expectSoundRuns } from './support/corpus.js';
import { describeWith } from './support/external.js';

const ROOT = '../shared/real-dxf';

/** What a run ended in: checked (with its exit code), or the reason it was refused. */
function outcome(r: CorpusRun): string {
  if (r.code === 0 || r.code === 1) return `checked ${r.code}`;
  if (/binary DXF is not supported/.test(r.message)) return 'binary';
  if (/does not state its length unit/.test(r.message)) return 'no unit';
  if (/no sprinkler heads found/.test(r.message)) return 'no heads';
  return `exit ${r.code}: ${r.message}`;
}

/** Per file: `layers`' exit code and what `check` ended in, with no config. */
const PLAIN: Record<string, [number, string]> = {
  'AdrianPKrawczyk-WENTCAD__WATT_0_PARTER.dxf': [0, 'no heads'],
  'DomCR-ACadSharp__sample_AC1009_ascii.dxf': [0, 'no unit'],
  'DomCR-ACadSharp__sample_AC1015_ascii.dxf': [0, 'no heads'],
  'DomCR-ACadSharp__sample_AC1018_binary.dxf': [2, 'binary'],
  'DomCR-ACadSharp__sample_AC1027_ascii.dxf': [0, 'no heads'],
  'DomCR-ACadSharp__sample_AC1032_ascii.dxf': [0, 'no heads'],
  'Evil-Spirit-TheHouseBuiltByProgrammer__plan.dxf': [0, 'no unit'],
  'LibreCAD-LibreCAD__dxf_dim_sample.dxf': [0, 'no heads'],
  'LibreCAD-LibreCAD__plan_air_water_aw21.dxf': [0, 'no unit'],
  'LibreCAD-LibreCAD__plan_architect_Complete-Lib-E.dxf': [0, 'no heads'],
  'LibreCAD-LibreCAD__sheets_A0H.dxf': [0, 'no heads'],
  'LibreDWG-libredwg__2000_TS1.dxf': [0, 'no heads'],
  'LibreDWG-libredwg__example_2000.dxf': [0, 'no heads'],
  'LibreDWG-libredwg__example_2004.dxf': [0, 'no heads'],
  'LibreDWG-libredwg__example_2007.dxf': [0, 'no heads'],
  'LibreDWG-libredwg__example_2010.dxf': [0, 'no heads'],
  'LibreDWG-libredwg__example_2013.dxf': [0, 'no heads'],
  'LibreDWG-libredwg__example_2018.dxf': [0, 'no heads'],
  'LibreDWG-libredwg__example_r12.dxf': [0, 'no unit'],
  'LibreDWG-libredwg__example_r14.dxf': [0, 'no unit'],
  'LibreDWG-libredwg__r2.6_entities.dxf': [0, 'no unit'],
  'anandkothartrdl-Plans__plan.dxf': [0, 'no unit'],
  'emfcamp-site-plan-2012__plan.dxf': [0, 'no heads'],
  'gdsestimating-dxf-parser__api-cw750-details.dxf': [0, 'no unit'],
  'gdsestimating-dxf-parser__blocks.dxf': [0, 'no unit'],
  'gdsestimating-dxf-parser__extendeddata.dxf': [0, 'no heads'],
  'gdsestimating-dxf-parser__mtext-test.dxf': [0, 'no heads'],
  'haplokuon-netDxf__sample.dxf': [0, 'no heads'],
  'ixmilia-dxf__diamond-bin.dxf': [2, 'binary'],
  'mozman-ezdxf__AC1003_LINE_Example.dxf': [0, 'no unit'],
  'mozman-ezdxf__ASCII_R12.dxf': [0, 'no unit'],
  'mozman-ezdxf__Leica_Disto_S910.dxf': [0, 'no unit'],
  'mozman-ezdxf__POLI-ALL210_12.DXF': [0, 'no unit'],
  'mozman-ezdxf__R12_with_trash_beyond_EOF.dxf': [0, 'no unit'],
  'mozman-ezdxf__bin_dxf_r12.dxf': [2, 'binary'],
  'mozman-ezdxf__bin_dxf_r2000.dxf': [2, 'binary'],
  'mozman-ezdxf__caret_encoding.dxf': [0, 'no heads'],
  'mozman-ezdxf__cc_dxflib.dxf': [0, 'no unit'],
  'mozman-ezdxf__custom_blocks.dxf': [0, 'no heads'],
  'mozman-ezdxf__duplicate_handles.dxf': [0, 'no unit'],
  'mozman-ezdxf__dxf_unicode.dxf': [0, 'no heads'],
  'mozman-ezdxf__examples_edgeminer_3_us_main.dxf': [0, 'no unit'],
  'mozman-ezdxf__geo_Graz_10km_3m.dxf': [0, 'no heads'],
  'mozman-ezdxf__houses_of_parliament_georeferenced.dxf': [0, 'no heads'],
  'mozman-ezdxf__insert_bricscad_level_1.dxf': [0, 'no heads'],
  'mozman-ezdxf__multi_insert_with_attribs.dxf': [0, 'no heads'],
  'mozman-ezdxf__recover01.dxf': [0, 'no unit'],
  'mozman-ezdxf__small_r13.dxf': [0, 'no unit'],
  'mozman-ezdxf__small_r14.dxf': [0, 'no unit'],
  'mozman-ezdxf__wipeout_door.dxf': [0, 'no heads'],
  'ono-hiroki-cad__house.dxf': [0, 'no unit'],
  'parkyjimbo-Drawings__Plumbing.dxf': [0, 'no unit'],
  'qcad-qcad__Hydraulics_3-2valve.dxf': [0, 'no heads'],
  'qcad-qcad__examples_flange.dxf': [0, 'no heads'],
  'qcad-qcad__misc_Bath_plan.dxf': [0, 'no heads'],
  'raumzeitlabor-olymp-2.0__floorplan.dxf': [0, 'no heads'],
  'shvmm-brick-home__front_home.dxf': [0, 'no heads'],
  'shvmm-brick-home__plumbing.dxf': [0, 'no heads'],
  'yorikvanhavre-barcelona-pavillion__pabellon_de_barcelona.dxf': [0, 'no heads'],
  'yorikvanhavre-barcelona-pavillion__plan.dxf': [0, 'no heads'],
};

/** With the corpus's configs that give a unit (every R12 file and the unitless ones). */
const WITH_UNITS: Record<string, [number, string]> = {
  'DomCR-ACadSharp__sample_AC1009_ascii.dxf': [0, 'no heads'],
  'Evil-Spirit-TheHouseBuiltByProgrammer__plan.dxf': [0, 'no heads'],
  'LibreCAD-LibreCAD__plan_air_water_aw21.dxf': [0, 'no heads'],
  'LibreDWG-libredwg__example_r12.dxf': [0, 'no heads'],
  'LibreDWG-libredwg__example_r14.dxf': [0, 'no heads'],
  'anandkothartrdl-Plans__plan.dxf': [0, 'no heads'],
  'gdsestimating-dxf-parser__api-cw750-details.dxf': [0, 'no heads'],
  'gdsestimating-dxf-parser__blocks.dxf': [0, 'no heads'],
  'mozman-ezdxf__AC1003_LINE_Example.dxf': [0, 'no heads'],
  'mozman-ezdxf__ASCII_R12.dxf': [0, 'no heads'],
  'mozman-ezdxf__Leica_Disto_S910.dxf': [0, 'no heads'],
  'mozman-ezdxf__POLI-ALL210_12.DXF': [0, 'no heads'],
  'mozman-ezdxf__cc_dxflib.dxf': [0, 'no heads'],
  'mozman-ezdxf__duplicate_handles.dxf': [0, 'no heads'],
  'mozman-ezdxf__examples_edgeminer_3_us_main.dxf': [0, 'no heads'],
  'mozman-ezdxf__small_r13.dxf': [0, 'no heads'],
  'mozman-ezdxf__small_r14.dxf': [0, 'no heads'],
  'ono-hiroki-cad__house.dxf': [0, 'no heads'],
  'parkyjimbo-Drawings__Plumbing.dxf': [0, 'no heads'],
};

/** With the corpus's configs that force roles onto layers (chairs as heads, cables as pipes: the pipeline must hold). */
const WITH_ROLES: Record<string, [number, string]> = {
  'LibreDWG-libredwg__example_2000.dxf': [0, 'checked 1'],
  'emfcamp-site-plan-2012__plan.dxf': [0, 'checked 1'],
  'gdsestimating-dxf-parser__api-cw750-details.dxf': [0, 'checked 1'],
  'parkyjimbo-Drawings__Plumbing.dxf': [0, 'checked 1'],
  'shvmm-brick-home__front_home.dxf': [0, 'checked 1'],
  'shvmm-brick-home__plumbing.dxf': [0, 'checked 1'],
};

function expectSound(rows: CorpusRow[], expected: Record<string, [number, string]>) {
  expect(rows.map((r) => r.file).sort()).toEqual(Object.keys(expected).sort());
  for (const r of rows) {
    expectSoundRuns(r);
    expect([r.layers.code, outcome(r.check)], r.file).toEqual(expected[r.file]);
  }
}

describeWith('../shared/real-dxf (the real-drawing corpus)', existsSync(`${ROOT}/files`), 'the real-drawing corpus', () => {
  it('every file, no config: one line, exit 0-2, within the limits, the recorded outcome', async () => {
    expectSound(await runCorpus(`${ROOT}/files`, { timeoutS: 90 }), PLAIN);
  }, 600_000);
  it("with the corpus's unit configs", async () => {
    expectSound(await runCorpus(`${ROOT}/files`, { timeoutS: 90, configs: `${ROOT}/configs/units`, onlyWithConfig: true }), WITH_UNITS);
  }, 600_000);
  it("with the corpus's role configs", async () => {
    expectSound(await runCorpus(`${ROOT}/files`, { timeoutS: 90, configs: `${ROOT}/configs/roles`, onlyWithConfig: true }), WITH_ROLES);
  }, 600_000);
});
