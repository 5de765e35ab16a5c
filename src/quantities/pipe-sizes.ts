// Nominal pipe sizes: reading size labels (1", 1-1/4", 1 1/4", 2½", DN32, 32mm) and the inside diameters
// of Schedule 10 and Schedule 40 steel pipe, each value with its source.

/** Pipe schedules whose inside diameters are tabled. */
export type Schedule = '10' | '40';

/** Nominal size keys in inches, as the report writes them. */
export const NOMINAL_SIZES = ['1/2', '3/4', '1', '1-1/4', '1-1/2', '2', '2-1/2', '3', '3-1/2', '4', '5', '6', '8'] as const;
export type NominalSize = (typeof NOMINAL_SIZES)[number];

/**
 * Inside diameters, inches. Schedule 40: 1, 1-1/4, 1-1/2, 2, 4 confirmed from ASME B36.10 dimensions; 2-1/2, 3, 6
 * from memory (same standard); 1/2, 3/4, 3-1/2, 5, 8 from memory. Schedule 10: computed from ASME B36.10/B36.19
 * published outside diameters and wall thicknesses (1 to 6); 1/2, 3/4, 3-1/2, 8 from memory.
 */
export const INSIDE_DIAMETER: Record<Schedule, Record<NominalSize, number>> = {
  '40': {
    '1/2': 0.622,
    '3/4': 0.824,
    '1': 1.049,
    '1-1/4': 1.38,
    '1-1/2': 1.61,
    '2': 2.067,
    '2-1/2': 2.469,
    '3': 3.068,
    '3-1/2': 3.548,
    '4': 4.026,
    '5': 5.047,
    '6': 6.065,
    '8': 7.981,
  },
  '10': {
    '1/2': 0.674,
    '3/4': 0.884,
    '1': 1.097,
    '1-1/4': 1.442,
    '1-1/2': 1.682,
    '2': 2.157,
    '2-1/2': 2.635,
    '3': 3.26,
    '3-1/2': 3.76,
    '4': 4.26,
    '5': 5.295,
    '6': 6.357,
    '8': 8.329,
  },
};

/** Metric designations (DN, or mm on the label) and the nominal inch size they stand for (common practice). */
const METRIC: Record<number, NominalSize> = {
  15: '1/2',
  20: '3/4',
  25: '1',
  32: '1-1/4',
  40: '1-1/2',
  50: '2',
  65: '2-1/2',
  80: '3',
  90: '3-1/2',
  100: '4',
  125: '5',
  150: '6',
  200: '8',
};

const UNICODE_FRACTIONS: Record<string, string> = { '\u00bc': '1/4', '\u00bd': '1/2', '\u00be': '3/4' };

/** The nominal size a label states, or null when the text is not a pipe size. */
export function parseSizeLabel(text: string): NominalSize | null {
  const t = text.trim().replace(/^[\u2300\u00d8\u00f8]\s*/, '');
  const metric = /^(?:DN\s*(\d{2,3})|(\d{2,3})\s*mm)$/i.exec(t);
  if (metric) return METRIC[Number(metric[1] ?? metric[2])] ?? null;
  const m = /^(\d{1,2})?(?:(?:\s*-\s*|\s+)?(\d)\/(\d)|\s*([\u00bc\u00bd\u00be]))?\s*(?:"|''|in\b|inch)/i.exec(t);
  if (!m || (m[1] === undefined && m[2] === undefined && m[4] === undefined)) {
    const dec = /^(\d{1,2}(?:\.\d+)?)\s*(?:"|''|in\b|inch)/i.exec(t);
    return dec ? fromDecimal(Number(dec[1])) : null;
  }
  const whole = m[1] ?? '';
  const frac = m[4] ? UNICODE_FRACTIONS[m[4]]! : m[2] ? `${m[2]}/${m[3]}` : '';
  const key = whole && frac ? `${whole}-${frac}` : whole || frac;
  return (NOMINAL_SIZES as readonly string[]).includes(key) ? (key as NominalSize) : null;
}

function fromDecimal(v: number): NominalSize | null {
  const byValue: Record<string, NominalSize> = {
    '0.5': '1/2',
    '0.75': '3/4',
    '1': '1',
    '1.25': '1-1/4',
    '1.5': '1-1/2',
    '2': '2',
    '2.5': '2-1/2',
    '3': '3',
    '3.5': '3-1/2',
    '4': '4',
    '5': '5',
    '6': '6',
    '8': '8',
  };
  return byValue[String(v)] ?? null;
}

/** Normalises a configured default size ("1.25", "1-1/4", "DN32", ...) or returns null. */
export function normaliseSize(value: string): NominalSize | null {
  if ((NOMINAL_SIZES as readonly string[]).includes(value)) return value as NominalSize;
  return parseSizeLabel(/["a-z]$/i.test(value) ? value : `${value}"`) ?? parseSizeLabel(value);
}
