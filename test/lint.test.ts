// The code is linted and formatted by Biome (biome.jsonc says which rules and why) and the tests are type-checked
// with the sources (tsconfig.test.json): a change that breaks either fails the tests as a broken rule would.

import { spawnSync } from 'node:child_process';
import { expect, it } from 'vitest';

it('biome ci: lint and format clean', () => {
  const r = spawnSync(process.execPath, ['node_modules/@biomejs/biome/bin/biome', 'ci', '--colors=off', '--error-on-warnings'], {
    encoding: 'utf8',
    timeout: 120_000,
  });
  expect(r.status, `${r.stdout}\n${r.stderr}`).toBe(0);
});

it('tsc: the tests type-check against the sources they call', () => {
  const r = spawnSync(process.execPath, ['node_modules/typescript/bin/tsc', '-p', 'tsconfig.test.json', '--pretty', 'false'], {
    encoding: 'utf8',
    timeout: 240_000,
  });
  expect(r.status, `${r.stdout}\n${r.stderr}`).toBe(0);
});
