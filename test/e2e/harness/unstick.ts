/**
 * Style for a screenshot: the toolbar, the step list and the Findings section index stick to the top of
 * the window, so in a picture of one card taller than the window (or of the whole page) they would be painted
 * over the card's first rows. Playwright applies it for the shot only (`screenshot({ style })`).
 */
export const UNSTICK = '.toolbar, .section-index, .steps { position: static !important; }';
