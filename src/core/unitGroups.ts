/**
 * A name the user wrote ("PI (25 %/K, 30 min)") with each number held to the unit after it: the space
 * between them becomes a no-break space (U+00A0), so a narrow column wraps the name between its groups
 * ("PI (25 %/K, | 30 min)"), never inside one ("PI (25 | %/K, 30 | min)"). A value and its unit
 * are kept on one line (typographic practice; common practice), as the numbers this program writes
 * keep theirs (exponentText.ts NO_BREAK_SPACE, shareText.ts).
 *
 * A name is free text, so "unit" is read loosely: what follows a digit and one space and starts with a
 * letter or a unit sign (%, ‰, °, µ, Ω, ′, ″), up to the next space or closing punctuation, and is at
 * most UNIT_GROUP_MOST characters long. A short word after a number ("2 loops") is held to it too —
 * harmless, it only takes one break away; a long one is not, so no group grows wider than a column.
 * Only where the name is shown: the text itself (saved, compared, copied) keeps the user's spaces, and
 * a copied table turns U+00A0 back into a space (components/tableText.ts).
 */
import { NO_BREAK_SPACE } from './exponentText';

/** The longest token taken as a unit ("%/min", "m³/h", "minutes"); ours, a choice. */
export const UNIT_GROUP_MOST = 8;

const NUMBER_THEN_UNIT = new RegExp(String.raw`(\d) (?=[\p{L}%‰°µΩ′″][^\s,;:)\]}]{0,${UNIT_GROUP_MOST - 1}}(?:[\s,;:)\]}]|$))`, 'gu');

/** "PI (25 %/K, 30 min)" → "PI (25 %/K, 30 min)" with U+00A0 after 25 and 30. */
export function keepUnitGroups(text: string): string {
  return text.replace(NUMBER_THEN_UNIT, `$1${NO_BREAK_SPACE}`);
}
