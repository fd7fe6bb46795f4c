/**
 * A project object that refuses fields it does not know (a misspelt "rigde" or "quadratureNode"
 * would otherwise be dropped without a word and the default used), naming the closest known field.
 * Every object of the schema is built with it, so a new field is accepted by listing it in the shape.
 * Free-form words of the user's own go under the top-level `notes` (schema.ts), which is kept as is.
 */
import { z } from 'zod';
import { closestName } from '../core/closestName';

/** Longest unknown field name quoted in a message (longer ones are cut). */
const QUOTED = 60;

export function strictObject<Shape extends z.ZodRawShape>(shape: Shape) {
  const known = Object.keys(shape);
  return z.strictObject(shape, {
    error: (issue) => (issue.code === 'unrecognized_keys' ? unknownFieldMessage(issue.keys, known) : undefined),
  });
}

/** `unknown field "rigde"; did you mean "ridge"? (fields here: …)`. */
export function unknownFieldMessage(keys: readonly string[], known: readonly string[]): string {
  const named = keys.slice(0, 3).map((key) => {
    const shown = JSON.stringify(key.length > QUOTED ? `${key.slice(0, QUOTED - 1)}…` : key);
    const best = closestName(key, known);
    return best === undefined ? shown : `${shown} (did you mean "${best}"?)`;
  });
  const more = keys.length > 3 ? ` and ${keys.length - 3} more` : '';
  const fields = keys.length === 1 ? 'field' : 'fields';
  return `unknown ${fields} ${named.join(', ')}${more}; the fields here are ${known.join(', ')} (your own remarks belong in the top-level "notes")`;
}
