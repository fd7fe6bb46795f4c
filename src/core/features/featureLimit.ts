/** Dense least squares is O(d³) per solve; beyond this many features a fit would not finish on a desktop. */
export const MAX_FEATURES = 2000;
