// Gating of tests that need a Debian package (ezdxf, LibreCAD, Chromium): skipped with a clear message
// where the tool is absent, and failing instead when HEADCHECK_REQUIRE_EXTERNAL=1 (set by .ci/run).

import { spawnSync } from 'node:child_process';
import { describe, it } from 'vitest';

export const REQUIRE_EXTERNAL = process.env['HEADCHECK_REQUIRE_EXTERNAL'] === '1';

/** Debian's ezdxf runs under /usr/bin/python3 (the python3 first on PATH may lack it). */
export const SYSTEM_PYTHON = '/usr/bin/python3';

export function hasEzdxf(): boolean {
  const r = spawnSync(SYSTEM_PYTHON, ['-c', 'import ezdxf'], { encoding: 'utf8', timeout: 30_000 });
  return r.status === 0;
}

/** `describe` that needs `tool`: runs when available, else skips (or fails when tools are required). */
export function describeWith(tool: string, available: boolean, name: string, body: () => void): void {
  if (available) {
    describe(name, body);
  } else if (REQUIRE_EXTERNAL) {
    describe(name, () => {
      it(`needs ${tool}`, () => {
        throw new Error(`${tool} is required (HEADCHECK_REQUIRE_EXTERNAL=1) but not installed`);
      });
    });
  } else {
    console.warn(`skipping "${name}": ${tool} is not installed (apt-get install the Debian package to run it)`);
    describe.skip(name, body);
  }
}

/** Whether a command is on PATH (looked up, not run: some GUI programs hang on --version). */
export function hasCommand(cmd: string): boolean {
  return spawnSync('sh', ['-c', `command -v ${cmd}`], { encoding: 'utf8' }).status === 0;
}

/** Chromium as root with nothing reaching out (playwright adds --headless), on a fresh profile folder. */
export async function launchChromium(profileDir: string, options: { width: number; height: number; downloads?: boolean }) {
  const { chromium } = await import('playwright-core');
  return chromium.launchPersistentContext(profileDir, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: options.width, height: options.height },
    acceptDownloads: options.downloads ?? false,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
}
