/**
 * The engineering cautions shown wherever estimates are shown or exported: on screen, in CLI output,
 * in image captions and reports. One text, so every host says the same.
 */
export const CAUTIONS: readonly string[] = [
  'These are offline, advisory estimates computed from logged data; they are not a guarantee of how the plant will behave.',
  'They extrapolate poorly where a candidate policy would take the plant outside the states and actions the logs cover.',
  'They assume one plant under one present controller over the whole logged period; where the plant, its instruments or the controller changed during it, evaluate only the runs since the last change.',
  'They assume every signal the present controller acts on (a feedforward on a measured load, a ratio, an operator’s setting) is a state column; a signal left out of the states biases every candidate’s estimate in a way the log cannot show.',
  'A policy reaches a plant only through the site’s own design review and commissioning procedures with qualified engineering sign-off, with independent safety functions and interlocks left in place, under local codes and licensed practice.',
];

/** One line for image captions. */
export const CAUTION_SHORT =
  'Advisory offline estimate — not a substitute for site review, commissioning and independent safety functions.';
