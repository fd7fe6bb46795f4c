/**
 * Tick and tooltip number text. Fixed notation with the tick set's digits in the usual range,
 * exponent notation for very large or very small magnitudes so labels stay short. The locale is
 * fixed ('en-US') so an exported figure reads the same on every machine.
 */
const EXPONENT_ABOVE = 1e6;
const EXPONENT_BELOW = 1e-4;

export function formatTick(value: number, fractionDigits: number): string {
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= EXPONENT_ABOVE || magnitude < EXPONENT_BELOW) return value.toExponential(2).replace('e+', 'e');
  return value.toLocaleString('en-US', { minimumFractionDigits: fractionDigits, maximumFractionDigits: fractionDigits });
}

/** A value with four significant digits, for tooltips and text summaries. */
export function formatValue(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= EXPONENT_ABOVE || magnitude < EXPONENT_BELOW) return value.toExponential(3).replace('e+', 'e');
  return Number(value.toPrecision(4)).toLocaleString('en-US', { maximumFractionDigits: 10 });
}
