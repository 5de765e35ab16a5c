// Full garbage collections between a check's stages, for large drawings: each stage leaves most of what it
// allocated behind, and V8 lets the heap grow to about four times what was live at its last full collection.

import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';

/** Below this size a drawing checks in a blink and a collection (10-40 ms) buys nothing. */
const LARGE_DRAWING_BYTES = 4 * 2 ** 20;

/**
 * Stages after which most of what was allocated is garbage: the drawing's raw geometry (after the plan), the
 * network's scaffolding and the coverage search (after coverage), the design-area search (by the report).
 * Measured on the 25 MB bench drawing: peak 244-263 MiB without, 216-221 MiB with, in the same time.
 */
const COLLECT_AFTER = new Set(['plan', 'coverage', 'report']);

let gc: (() => void) | null | undefined;

/** V8's collector, reached by setting its --expose-gc flag at run time and reading `gc` from a new context; null where refused. */
function collector(): (() => void) | null {
  if (gc === undefined) {
    try {
      setFlagsFromString('--expose-gc');
      const found: unknown = runInNewContext('typeof gc === "function" ? gc : null');
      gc = typeof found === 'function' ? (found as () => void) : null;
    } catch {
      gc = null;
    }
  }
  return gc;
}

/** A stage hook for runCheck that collects after the stages above when the drawing is large; else none. */
export function collectBetweenStages(drawingBytes: number): ((stage: string) => void) | undefined {
  if (drawingBytes < LARGE_DRAWING_BYTES) return undefined;
  const collect = collector();
  return collect
    ? (stage) => {
        if (COLLECT_AFTER.has(stage)) collect();
      }
    : undefined;
}
