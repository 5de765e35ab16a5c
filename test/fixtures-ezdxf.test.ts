// The committed fixtures are reproducible: running the ezdxf script again gives the same ground truth.
// Needs Debian's python3-ezdxf; skipped without it, required in CI.

import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { describeWith, hasEzdxf, SYSTEM_PYTHON } from './support/external.js';

describeWith('python3-ezdxf', hasEzdxf(), 'fixtures written by ezdxf', () => {
  it('regenerates to the same ground truth', () => {
    const dir = mkdtempSync(join(tmpdir(), 'hc-fixtures-'));
    try {
      const r = spawnSync(SYSTEM_PYTHON, ['scripts/make-fixtures.py', dir], { encoding: 'utf8', timeout: 120_000 });
      expect(r.status, r.stderr).toBe(0);
      for (const truth of ['bay2.truth.json', 'first-contact.truth.json', 'building.truth.json']) {
        const fresh = JSON.parse(readFileSync(join(dir, truth), 'utf8'));
        const committed = JSON.parse(readFileSync(join('fixtures', truth), 'utf8'));
        delete fresh.writer;
        delete committed.writer;
        expect(fresh).toEqual(committed);
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
