/**
 * The one writer of a value axis's title — V, Q or J with its sense and unit, as rich text — for the
 * app's charts, their PNG and SVG exports and the report alike: "J, discounted cost (€)",
 * "V^{π}(s), discounted cost (€)", "Q^{π}(s, a), discounted reward". The unit is the project's, held
 * trimmed by the document (project/unitText.ts); '' where it gives none, and then no brackets.
 */

export type ValueSymbol = 'V' | 'Q' | 'J';

const HEADS: Record<ValueSymbol, string> = { V: 'V^{π}(s)', Q: 'Q^{π}(s, a)', J: 'J' };

export function valueAxisTitle(symbol: ValueSymbol, sense: 'cost' | 'reward', unit = ''): string {
  return `${HEADS[symbol]}, discounted ${sense}${unit ? ` (${unit})` : ''}`;
}
