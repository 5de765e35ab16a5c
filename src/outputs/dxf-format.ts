// Formats DXF group code/value pairs as text, numbers in plain decimal notation: what headcheck writes.

/** Formats group code/value pairs as DXF lines. */
export function formatGroups(pairs: readonly (string | number)[], eol = '\n'): string {
  let s = '';
  for (let i = 0; i < pairs.length; i += 2) {
    const v = pairs[i + 1]!;
    s += `${String(pairs[i]).padStart(3)}${eol}${typeof v === 'number' ? formatNumber(v) : v}${eol}`;
  }
  return s;
}

/** Plain decimal notation with ten decimals at most (readers differ on exponents). */
const formatNumber = (v: number): string =>
  Number.isInteger(v) ? String(v) : Math.abs(v) < 1e-10 ? '0' : v.toFixed(10).replace(/0+$/, '').replace(/\.$/, '');
