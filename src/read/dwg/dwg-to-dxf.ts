// DWG drawings as DXF: GNU LibreDWG compiled to WebAssembly (@mlightcad/libredwg-web) reads the DWG and writes the
// same drawing as DXF (handles kept), which the DXF reader then reads like any other. Runs in Node and browsers.

import * as libredwg from '@mlightcad/libredwg-web';
import { fail } from '../../input-error.js';
import { dwgRelease, dwgVersionTag } from './version.js';

/** What this module uses of the Emscripten module (its own typings do not resolve its factory). */
interface LibreDwgModule {
  FS: {
    writeFile(path: string, data: Uint8Array): void;
    readFile(path: string): Uint8Array;
    analyzePath(path: string, dontResolveLastLink: boolean): { exists: boolean };
  };
  /** Reads the DWG at one path, writes it as DXF at the other; LibreDWG's error bits. */
  dwg_write_dxf(dwgPath: string, dxfPath: string): number;
}
type ModuleFactory = (options: {
  instantiateWasm: (imports: WebAssembly.Imports, done: (instance: WebAssembly.Instance) => unknown) => Promise<unknown>;
  print: (s: string) => void;
  printErr: (s: string) => void;
  thisProgram: string;
  preRun: ((m: { ENV: Record<string, string> }) => void)[];
}) => Promise<LibreDwgModule>;
const createModule = (libredwg as unknown as { createModule: ModuleFactory }).createModule;

/** LibreDWG's error bits from 128 up are fatal: the drawing was not read (below, it was read with repairs). */
const FATAL_ERRORS: [number, string][] = [
  [128, 'classes not found'],
  [256, 'section not found'],
  [512, 'page not found'],
  [1024, 'internal error'],
  [2048, 'invalid DWG'],
  [4096, 'input error'],
  [8192, 'out of memory'],
];

export interface DwgLimits {
  /** Most memory the converter may grow to, MiB. */
  memoryMB: number;
}

/**
 * The DWG as DXF bytes. `wasm` is the compiled LibreDWG module (compiled once); each call instantiates it afresh (a
 * second drawing in one instance can crash it). Bad input is an InputError naming what is wrong.
 */
export async function dwgToDxf(bytes: Uint8Array, wasm: WebAssembly.Module, limits: DwgLimits): Promise<Uint8Array> {
  const tag = dwgVersionTag(bytes);
  if (!tag) fail('not a DWG file');
  if (!dwgRelease(tag!)) {
    fail(`DWG version ${tag} is not supported (R13 to 2018 are); save the drawing as DXF or as a DWG of 2018 or older`);
  }
  const cap = limits.memoryMB * 1024 * 1024;
  let refused = false;
  const mod = await createModule({
    // The memory limit: the module asks its host to grow its memory, and the host says no past the cap.
    instantiateWasm: (imports, done) => {
      const env = imports['env'] as Record<string, unknown>;
      const grow = env['emscripten_resize_heap'] as (size: number) => boolean;
      env['emscripten_resize_heap'] = (size: number) => {
        if (size >>> 0 > cap) {
          refused = true;
          return false;
        }
        return grow(size);
      };
      return WebAssembly.instantiate(wasm, imports).then((instance) => done(instance));
    },
    print: () => undefined,
    printErr: () => undefined,
    // The same process environment everywhere. The module's environment strings are allocated before the drawing
    // is read, and LibreDWG reads past the end of some strings (an MTEXT of a 2018 sample): with the program's path
    // and the locale in them, the bytes it read, and so the DXF, changed with the folder headcheck ran from.
    thisProgram: 'headcheck',
    preRun: [
      (m) => {
        m.ENV['LANG'] = 'C.UTF-8';
      },
    ],
  });
  let error: number;
  try {
    mod.FS.writeFile('in.dwg', bytes);
    error = mod.dwg_write_dxf('in.dwg', 'out.dxf');
  } catch (err) {
    if (refused) fail(`reading the DWG needs more than ${limits.memoryMB} MiB`);
    return fail(`the DWG could not be read (${err instanceof Error ? err.message : String(err)})`);
  }
  if (refused) fail(`reading the DWG needs more than ${limits.memoryMB} MiB`);
  const fatal = FATAL_ERRORS.filter(([bit]) => error & bit).map(([, what]) => what);
  if (fatal.length) fail(`the DWG could not be read: ${fatal.join(', ')} (LibreDWG error ${error})`);
  const dxf = mod.FS.analyzePath('out.dxf', false).exists ? mod.FS.readFile('out.dxf') : null;
  // Past a damaged header LibreDWG may still write a DXF: its header alone, without an ENTITIES section.
  if (!dxf || !hasEntitiesSection(dxf)) fail(`the DWG could not be read (LibreDWG found no drawing in it; error ${error})`);
  return dxf!;
}

/** Whether the DXF text holds a line "ENTITIES" (the section's name); a byte search, the text may be any code page. */
function hasEntitiesSection(dxf: Uint8Array): boolean {
  const name = [...'ENTITIES'].map((c) => c.charCodeAt(0));
  for (let i = dxf.indexOf(name[0]!); i >= 0; i = dxf.indexOf(name[0]!, i + 1)) {
    if (dxf[i - 1] !== 0x0a) continue;
    let j = 1;
    while (j < name.length && dxf[i + j] === name[j]) j++;
    if (j === name.length && (dxf[i + j] === 0x0d || dxf[i + j] === 0x0a)) return true;
  }
  return false;
}
