/**
 * Parses a CSV cell as a finite decimal number (plain or scientific, e.g. "-1.2e-9"), surrounding spaces allowed.
 * Returns NaN for "", blanks, non-numbers, ±Infinity and the 0x/0o/0b forms that Number() would otherwise accept.
 */
export function parseStrictNumber(cell: string | undefined): number {
  if (cell === undefined) return Number.NaN;
  let text = cell;
  let first = text.charCodeAt(0);
  // Only cells that start with white space pay for a trim; Number() ignores trailing white space itself.
  if (first <= 32 || first === 0xa0 || first === 0xfeff || (first >= 0x1680 && first <= 0x3000)) {
    text = text.trim();
    first = text.charCodeAt(0);
  }
  if (text.length === 0) return Number.NaN;
  if (first === 48 && text.length > 1) {
    const second = text.charCodeAt(1) | 0x20;
    if (second === 120 || second === 111 || second === 98) return Number.NaN; // x, o, b
  }
  const value = Number(text);
  return Number.isFinite(value) ? value : Number.NaN;
}
