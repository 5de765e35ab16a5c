// The Web Worker of the local page: runs the same pure pipeline as the CLI on a dropped drawing (a DWG converted
// first) and returns the outputs, byte-identical to what `headcheck check` writes for the same file name and config.

import { FORMAT_NAMES, FORMATS, type FormatName } from '../check/formats.js';
import { runCheck } from '../check/run-check.js';
import { parseSettings } from '../config/settings.js';
import type { UnitSystem } from '../quantities/convert.js';
import { InputError } from '../input-error.js';
import { dwgVersionTag } from '../read/dwg/version.js';

/** One output of the check as the page offers it for download. */
export interface PageOutput {
  format: FormatName;
  description: string;
  extension: string;
  blob: Blob;
}

export interface CheckRequest {
  bytes: ArrayBuffer;
  fileName: string;
  config: unknown;
  units: UnitSystem;
}
export type CheckReply =
  | { type: 'progress'; stage: string }
  /** A DWG is being converted: the page ends the worker past `seconds` (the conversion cannot be interrupted). */
  | { type: 'reading-dwg'; seconds: number }
  | { type: 'done'; outputs: PageOutput[]; layers: { name: string; counts: Record<string, number> }[]; summary: unknown }
  | { type: 'error'; message: string };

const worker = self as unknown as {
  onmessage: ((e: MessageEvent<CheckRequest>) => void) | null;
  postMessage(m: CheckReply, t?: Transferable[]): void;
};

const hex = (buf: ArrayBuffer) => [...new Uint8Array(buf)].map((b) => b.toString(16).padStart(2, '0')).join('');

worker.onmessage = async (e) => {
  const { bytes, fileName, config, units } = e.data;
  try {
    const raw = new Uint8Array(bytes);
    const settings = parseSettings(config, 'settings');
    const dwgVersion = dwgVersionTag(raw);
    let data: Uint8Array = raw;
    if (dwgVersion) {
      worker.postMessage({ type: 'reading-dwg', seconds: settings.inputLimits.dwgSeconds });
      const { dwgAsDxfInPage } = await import('./dwg-loader.js');
      data = await dwgAsDxfInPage(raw, settings.inputLimits.dwgMemoryMB);
      worker.postMessage({ type: 'progress', stage: 'DWG conversion' });
    }
    const sha256 = hex(await crypto.subtle.digest('SHA-256', raw));
    const input = { bytes: data, fileName, sha256, dwgVersion, settings, reportUnits: units };
    const result = runCheck({ ...input, onStage: (stage) => worker.postMessage({ type: 'progress', stage }) });
    worker.postMessage({ type: 'progress', stage: 'outputs' });
    const outputs = FORMAT_NAMES.map((format): PageOutput => {
      const { description, extension, mediaType, make } = FORMATS[format];
      const data = make(result);
      return { format, description, extension, blob: new Blob((Array.isArray(data) ? data : [data]) as BlobPart[], { type: mediaType }) };
    });
    worker.postMessage({ type: 'done', outputs, layers: result.drawing.layers, summary: result.report.summary });
  } catch (err) {
    worker.postMessage({
      type: 'error',
      message:
        err instanceof InputError ? `${fileName}: ${err.message}` : `internal error: ${err instanceof Error ? err.message : String(err)}`,
    });
  }
};
