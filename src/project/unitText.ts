/**
 * A unit as the project holds it: what the user typed without the spaces around it ("€", "°C", "kg/h";
 * " € " is held as "€", a blank one as ""). The one place a unit is trimmed: the schema reads every unit
 * of a project file through it (states, actions, derived states, the cost's or reward's unit), and the
 * app's unit fields write through it, so every host downstream (labels, tables, axis titles, the
 * report, the command line) reads the unit as held and trims nothing.
 */
import { z } from 'zod';

/** A unit's text, trimmed at the document's boundary. */
export const unitText = z.string().trim();

/** The unit a field's typed text is held as in the document. */
export function heldUnit(typed: string): string {
  return unitText.parse(typed);
}
