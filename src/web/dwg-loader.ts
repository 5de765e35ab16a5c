// The page's DWG reader: LibreDWG's WebAssembly module, fetched from the local server and compiled the first time a
// DWG is dropped (this module is its own chunk, loaded only then), then converted like on the command line.

import wasmUrl from 'libredwg-web.wasm?url'; // an alias in vite.web.config.ts
import { dwgToDxf } from '../read/dwg/dwg-to-dxf.js';

let compiled: Promise<WebAssembly.Module> | null = null;

/** The DWG as DXF bytes; InputError for a DWG the reader refuses. */
export async function dwgAsDxfInPage(bytes: Uint8Array, memoryMB: number): Promise<Uint8Array> {
  compiled ??= fetch(wasmUrl)
    .then((r) => (r.ok ? r.arrayBuffer() : Promise.reject(new Error(`the DWG reader could not be loaded (${r.status})`))))
    .then((buffer) => WebAssembly.compile(buffer));
  return dwgToDxf(bytes, await compiled, { memoryMB });
}
