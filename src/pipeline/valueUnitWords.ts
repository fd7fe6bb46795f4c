/**
 * J's unit said once where a table or a sentence states it: "in €" where the project gives the cost's or
 * reward's unit (`columns.reward.unit`), and "no unit given" in plain words where it gives none — never a
 * bare dash, which read as a missing number. J, V and Q are in that unit, discounted. Every host (the
 * app's Findings and Plant log, the report, the command line) reads these words from here.
 */

/** The words where a unit would stand and the project gives none. */
export const NO_UNIT_GIVEN = 'no unit given';

/**
 * The unit as every host writes it: the project's `columns.reward.unit`, '' where it gives none. The
 * document holds it trimmed (project/unitText.ts), so nothing here trims; the words, heads and axis titles read it.
 */
export function valueUnitText(unit: string | null | undefined): string {
  return unit ?? '';
}

/** "in €", or "no unit given" for a blank unit. */
export function valueUnitWords(unit: string | null | undefined): string {
  const u = valueUnitText(unit);
  return u ? `in ${u}` : NO_UNIT_GIVEN;
}

/** What J is, in one sentence without its full stop, as the Findings' answer and values tables say it: "J is the expected discounted cost from the start states on, in € (lower is better)". */
export function valueSenseSentence(sense: 'cost' | 'reward', unit: string | null | undefined): string {
  return `J is the expected discounted ${sense} from the start states on, ${valueUnitWords(unit)} (${sense === 'cost' ? 'lower' : 'higher'} is better)`;
}

/**
 * A table's column head for J (or a value in J's unit): "J (€)" where the project gives the unit, the
 * head alone where it gives none — then the sentence above the table says "no unit given".
 */
export function valueColumnHead(head: string, unit: string | null | undefined): string {
  const u = valueUnitText(unit);
  return u ? `${head} (${u})` : head;
}
