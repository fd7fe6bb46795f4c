/**
 * Which of a candidate's problems the editor already shows beside a field, and for the rest a
 * place in words ("Form", "Rate limit") to stand before the message instead of a field path.
 * Paths are relative to the candidate ("form.loops.0.integralState").
 */
const FEEDBACK = '(measurement|setpoint|proportionalGain|integralTimeSeconds|integralGain|integralState|action)';
const SHOWN = new RegExp(
  '^(name|dither\\.\\d+|bounds|bounds\\.(lo|hi)\\.\\d+|rateLimit(\\.(maxStep|previousAction)(\\.\\d+)?)?'
  + '|form\\.offset\\.\\d+|form\\.gain\\.\\d+\\.\\d+'
  + `|form\\.loops\\.\\d+\\.(bias|${FEEDBACK.slice(1, -1)}|input|breakpoints(\\.\\d+)?|values(\\.\\d+)?|feedback\\.${FEEDBACK})`
  + ')$',
);

/** True when a field of the editor shows the problem at this candidate-relative path. */
export function shownBesideField(relativePath: string): boolean {
  return SHOWN.test(relativePath);
}

/** A place in words for a problem no field shows, with the action column where the path names one. */
export function problemPlace(relativePath: string, actionColumns: readonly string[]): string {
  const loop = /^form\.(?:loops|offset|gain)\.(\d+)/.exec(relativePath);
  const column = loop ? actionColumns[Number(loop[1])] : undefined;
  if (relativePath.startsWith('form')) return column ? `Form, ${column}` : 'Form';
  if (relativePath.startsWith('dither')) return 'Dither';
  if (relativePath.startsWith('bounds')) return 'Actuator limits';
  if (relativePath.startsWith('rateLimit')) return 'Rate limit';
  return 'Candidate';
}
