/**
 * The project document: everything needed to reproduce an evaluation — which data file and how to
 * read it, the roles of its columns, the candidate policies, and the estimator settings.
 *
 * Stored as JSON in a `.spcritic` file. One schema, with a version; older versions are migrated
 * (see migrations.ts). Field names are ours; the README documents them.
 */
import { z } from 'zod';
import { MAX_RETUNE_AXES, MAX_RETUNE_AXIS_POINTS, MIN_RETUNE_AXIS_POINTS } from '../core/retune/retuneAxes';
import { strictObject } from './strictObject';
import { finite } from './finiteNumber';
import { approximatorSchema } from './approximatorSchema';
import { unitText } from './unitText';
import { runLabelLength } from '../core/runLabelText';
import {
  BOOTSTRAP_RESAMPLES, CONFIDENCE_LEVEL, MAX_DERIVED_STATES, MAX_RETUNE_MAPS, MAX_SCHEDULE_BREAKPOINTS, DEFAULT_QUADRATURE_NODES, DISCOUNT_RANGE, MAX_ACTION_COLUMNS, MAX_CANDIDATES, MAX_EXPRESSION_LENGTH,
  MAX_GAUSS_HERMITE_NODES, MIN_QUADRATURE_NODES, MAX_PREVIOUS_STEPS, MAX_RUN_LABEL_LENGTH, MAX_RUN_RANGES_LEFT_OUT, MAX_STATE_COLUMNS, SEED, SURFACE_RESOLUTION,
} from '../core/limits';

export const PROJECT_FORMAT = 'setpoint-critic-project';
export const PROJECT_VERSION = 1;
export const PROJECT_EXTENSION = '.spcritic';

const columnName = z.string().trim().min(1, 'expected a column name');
/** A limit that may be absent on one side: null means "no limit". */
const optionalLimit = finite.nullable();

const signalSchema = strictObject({
  column: columnName,
  /** Engineering unit shown on axes, e.g. "m", "°C", "%"; held trimmed (unitText.ts). */
  unit: unitText.default(''),
});

/** The reward's or cost's own unit (e.g. "€", "kWh"); J, V and Q are in it, discounted. Optional; held trimmed (unitText.ts). */
const valueUnit = unitText.max(40).optional();

/**
 * A reward read from a column may declare what its definition guarantees: never below `atLeast`,
 * never above `atMost` (e.g. 0 for a cost that sums squares or energy used). Every logged row is
 * checked against it on import; the assessment cuts a range to report there (src/pipeline/assessPossible.ts).
 * A formula's own bounds are found from it (src/data/expressionBounds.ts), so it declares none.
 */
const rewardSchema = z.discriminatedUnion('kind', [
  strictObject({ kind: z.literal('column'), column: columnName, sense: z.enum(['reward', 'cost']), unit: valueUnit, atLeast: finite.optional(), atMost: finite.optional() }),
  strictObject({ kind: z.literal('expression'), expression: z.string().trim().min(1).max(MAX_EXPRESSION_LENGTH, `expected at most ${MAX_EXPRESSION_LENGTH} characters`), sense: z.enum(['reward', 'cost']), unit: valueUnit }),
]).superRefine((r, ctx) => {
  if (r.kind === 'column' && r.atLeast !== undefined && r.atMost !== undefined && r.atLeast > r.atMost) {
    ctx.addIssue({ code: 'custom', path: ['atMost'], message: `the ${r.sense} is declared never above ${r.atMost} but never below ${r.atLeast}; expected atLeast at or below atMost` });
  }
});

const nextStateSchema = z.discriminatedUnion('kind', [
  /** s' is the state on the next row of the same episode. */
  strictObject({ kind: z.literal('nextRow') }),
  /** s' is given on the same row, one column per state, in the order of `states`. */
  strictObject({ kind: z.literal('columns'), columns: z.array(columnName).min(1) }),
]);

const episodeSchema = z.discriminatedUnion('kind', [
  strictObject({ kind: z.literal('column'), column: columnName }),
  /** A new episode starts where the timestamp jumps by more than maxGapSeconds (default: 3× the median period). */
  strictObject({ kind: z.literal('timeGap'), column: columnName, maxGapSeconds: finite.positive().optional() }),
  strictObject({ kind: z.literal('single') }),
]);

/** A time in the timestamp column's own terms: seconds (a number), or a date and time written like its cells (src/data/timestampCell.ts). */
const timeValue = z.union([finite, z.string().trim().min(1, 'expected a time, e.g. "2024-03-01 06:00" or a number of seconds').max(64)]);

/**
 * A time window left out of the import (a start-up, a plant test): rows with a timestamp from
 * `from` to `to` (both included) are left out and counted, and the run is cut there
 * (src/data/timeWindows.ts). Windows that need the log to be checked (outside it, overlapping,
 * unreadable) are checked on import.
 */
export const excludedTimeSchema = strictObject({
  from: timeValue,
  to: timeValue,
  reason: z.string().trim().max(200).default(''),
}).superRefine((w, ctx) => {
  if (typeof w.from === 'number' && typeof w.to === 'number' && w.to < w.from) {
    ctx.addIssue({ code: 'custom', path: ['to'], message: `the window ends (${w.to}) before it starts (${w.from}); expected an end at or after the start` });
  }
});

/** A run label as the run column's cells read (trimmed, as the import reads them; src/core/runLabelText.ts). */
const runLabel = z.string({ error: (issue) => `expected a run label${issue.input === undefined ? '' : ' in quotes'}, as the run column’s cells read, e.g. "40"` }).trim()
  .min(1, 'expected a run label, as the run column’s cells read, e.g. "40"')
  .refine((label) => runLabelLength(label) <= MAX_RUN_LABEL_LENGTH, `expected a run label of at most ${MAX_RUN_LABEL_LENGTH} characters`);

/**
 * Runs left out of the import by their label (a retune, a trip test): every row of the runs from
 * `from` to `to` (both included; `to` absent: that one run), in the order the runs first appear in
 * the data, is left out and counted (src/data/runRanges.ts). Needs a run column; labels that are
 * not in the log, ranges that run backwards or overlap, and ranges that leave no run are checked on
 * import.
 */
export const excludedRunSchema = strictObject({
  from: runLabel,
  to: runLabel.optional(),
  reason: z.string().trim().max(200).default(''),
});

export const csvSettingsSchema = strictObject({
  delimiter: z.enum(['auto', ',', ';', '\t']).default('auto'),
  decimalMark: z.enum(['auto', '.', ',']).default('auto'),
  /** What to do with a row that cannot be used: stop the import, or exclude it (counted and listed). */
  badRows: z.enum(['stop', 'exclude']).default('stop'),
  /** Time windows whose rows are left out (needs a timestamp column); the rows are counted per window. */
  excludedTimes: z.array(excludedTimeSchema).max(100, 'expected at most 100 time windows left out').optional(),
  /** Runs whose rows are left out, by the run column's labels (needs a run column); the rows and runs are counted per range. */
  excludedRuns: z.array(excludedRunSchema).max(MAX_RUN_RANGES_LEFT_OUT, `expected at most ${MAX_RUN_RANGES_LEFT_OUT} ranges of runs left out`).optional(),
});

export const dataSourceSchema = strictObject({
  /** Path of the CSV relative to the project file's folder, with forward slashes. */
  path: z.string().trim().min(1, 'expected the path of the data file'),
  /** SHA-256 of the file's bytes when the project was last saved, to detect a changed file. */
  sha256: z.string().regex(/^[0-9a-f]{64}$/, 'expected 64 hexadecimal digits').optional(),
  /** Data rows (without the header) when the project was last saved. */
  rowCount: z.number().int().nonnegative().optional(),
  csv: csvSettingsSchema.default({ delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' }),
});

/**
 * States derived from logged signals during import, per episode (src/data/derivedStates.ts, where
 * the formulas and the reason they are Markov under a candidate are written out). A state column
 * may name one of them instead of a file column. Sources are file columns; an action column may be
 * used only by a "previous" state (the previous action, for a rate limit, or the valve positions
 * still travelling through a dead time).
 */
const derivedName = columnName;
const derivedUnit = unitText.default('');
/** How many rows back a "previous" derived state reads: its `steps`, 1 when it gives none (the one place that default lives). */
export function previousSteps(d: { readonly steps?: number }): number {
  return d.steps ?? 1;
}

export const derivedStateSchema = z.discriminatedUnion('kind', [
  /** I_t = initial + Σ_{k<t} (setpoint − measurement)_k·Δt_k from the episode start, in measurement unit·s. */
  strictObject({
    kind: z.literal('errorIntegral'), name: derivedName, unit: derivedUnit,
    measurement: columnName,
    /** A constant setpoint, or the name of a setpoint column. */
    setpoint: z.union([finite, columnName]),
    initial: finite.default(0),
    /** Δt per step; without it Δt comes from the timestamp column. */
    periodSeconds: finite.positive().optional(),
  }),
  /** First-order lag f_t = f_{t−1} + (1 − e^{−Δt/τ})(x_t − f_{t−1}); starts at `initial` or the first sample. */
  strictObject({
    kind: z.literal('filtered'), name: derivedName, unit: derivedUnit, source: columnName,
    timeConstantSeconds: finite.positive('expected a positive time constant in seconds'),
    initial: finite.optional(),
    periodSeconds: finite.positive().optional(),
  }),
  /**
   * x_{t−k} with k = `steps` (default 1); on an episode's first k rows `initial`, or (without it) those
   * rows only supply values for later ones. A value k rows back needs the values 1 … k − 1 rows back
   * of the same source among the states (derivedStateConsistency.ts).
   */
  strictObject({
    kind: z.literal('previous'), name: derivedName, unit: derivedUnit, source: columnName, initial: finite.optional(),
    steps: z.number().int('expected a whole number of rows').min(1, 'expected at least 1 row back').max(MAX_PREVIOUS_STEPS, `at most ${MAX_PREVIOUS_STEPS} rows back`).optional(),
  }),
  /** x_t − x_{t−1}; on an episode's first row `initial`, or (without it) that row only supplies x_{t−1}. */
  strictObject({ kind: z.literal('difference'), name: derivedName, unit: derivedUnit, source: columnName, initial: finite.optional() }),
]);

export const columnRolesSchema = strictObject({
  states: z.array(signalSchema).min(1, 'expected at least one state column').max(MAX_STATE_COLUMNS, `at most ${MAX_STATE_COLUMNS} state columns are supported`),
  actions: z.array(signalSchema).min(1, 'expected at least one action column').max(MAX_ACTION_COLUMNS, `at most ${MAX_ACTION_COLUMNS} action columns are supported`),
  reward: rewardSchema,
  nextState: nextStateSchema.default({ kind: 'nextRow' }),
  episode: episodeSchema.default({ kind: 'single' }),
  /** Column that is 1 (or true) on rows whose next state is terminal. */
  terminal: columnName.optional(),
  /** Timestamp column, for the sampling period and time checks (a timeGap episode rule names its own). */
  timestamp: columnName.optional(),
  /** States computed from the log during import; states may name them. */
  derived: z.array(derivedStateSchema).max(MAX_DERIVED_STATES, `at most ${MAX_DERIVED_STATES} derived states`).optional(),
});

export const actuatorBoundsSchema = strictObject({
  lo: z.array(optionalLimit),
  hi: z.array(optionalLimit),
  /** clip: actions beyond a limit sit at the limit; truncate: the distribution is cut and renormalised. */
  mode: z.enum(['clip', 'truncate']),
});

/** Feedback on a setpoint error (P or PI), as a control engineer writes it. */
const feedbackFields = {
  /** The measured state (a state column or a derived state). */
  measurement: columnName,
  /** A constant setpoint in the measurement's unit, or the name of a setpoint state. */
  setpoint: z.union([finite, columnName]),
  /** Controller gain K_c ≥ 0, action unit per measurement unit; the direction sets the sign. */
  proportionalGain: finite.nonnegative('expected a gain ≥ 0; choose the direction with "action"'),
  /** Integral time T_i (K_i = K_c/T_i); or give integralGain; neither for P only. */
  integralTimeSeconds: finite.positive('expected a positive integral time in seconds').optional(),
  /** Integral gain K_i, action unit per (measurement unit·s), instead of an integral time. */
  integralGain: finite.nonnegative().optional(),
  /** The derived error-integral state Σ (setpoint − measurement)·Δt, needed with integral action. */
  integralState: columnName.optional(),
  /** reverse: output rises as the measurement falls below the setpoint (heating); direct: the opposite (cooling). */
  action: z.enum(['reverse', 'direct']),
};
export const feedbackSchema = strictObject(feedbackFields);
export const piLoopSchema = strictObject({
  /** Output at zero error and zero integral, in the action's unit. */
  bias: finite,
  ...feedbackFields,
});
export const scheduleLoopSchema = strictObject({
  /** The state the schedule reads (e.g. outdoor temperature). */
  input: columnName,
  /** Strictly increasing values of the input; the output is held beyond the first and last. */
  breakpoints: z.array(finite).min(1).max(MAX_SCHEDULE_BREAKPOINTS),
  /** Output at each breakpoint, in the action's unit; straight lines between. */
  values: z.array(finite).min(1).max(MAX_SCHEDULE_BREAKPOINTS),
  /** Optional P/PI trim added to the schedule (no bias of its own). */
  feedback: feedbackSchema.optional(),
});

/** How the candidate's mean action depends on the states: one form per candidate, one loop per action. */
export const candidateFormSchema = z.discriminatedUnion('kind', [
  /** μ(s) = offset + gain·s, in the units of the action and state columns. */
  strictObject({ kind: z.literal('affine'), offset: z.array(finite).min(1), gain: z.array(z.array(finite)).min(1) }),
  strictObject({ kind: z.literal('pi'), loops: z.array(piLoopSchema).min(1).max(MAX_ACTION_COLUMNS) }),
  strictObject({ kind: z.literal('schedule'), loops: z.array(scheduleLoopSchema).min(1).max(MAX_ACTION_COLUMNS) }),
]);

/** |a − a_prev| ≤ maxStep per sample, per action (null: no rate limit on that action). */
export const rateLimitSchema = strictObject({
  maxStep: z.array(finite.positive('expected a positive step limit').nullable()).min(1),
  /** The derived "previous" state of each action column (null where maxStep is null). */
  previousAction: z.array(columnName.nullable()).min(1),
});

const ditherSchema = z.array(finite.positive('expected a positive standard deviation')).min(1);

/**
 * A candidate as written. The form may also be given the older way, as top-level `offset` and
 * `gain` (the affine form); `std` is the older name of `dither`. Both are read and turned into the
 * current shape, so older project files load unchanged.
 */
export const candidateSchema = strictObject({
  name: z.string().trim().min(1, 'expected a name'),
  description: z.string().default(''),
  form: candidateFormSchema.optional(),
  /** Older affine form: μ(s) = offset + gain·s (read into form). */
  offset: z.array(finite).min(1).optional(),
  gain: z.array(z.array(finite)).min(1).optional(),
  /** Dither: the standard deviation of each action around the mean, in the action's unit. */
  dither: ditherSchema.optional(),
  /** Older name of dither. */
  std: ditherSchema.optional(),
  /** Position limits of the actuator. */
  bounds: actuatorBoundsSchema.optional(),
  rateLimit: rateLimitSchema.optional(),
}).superRefine((c, ctx) => {
  if (c.form && (c.offset || c.gain)) ctx.addIssue({ code: 'custom', path: [c.offset ? 'offset' : 'gain'], message: 'give the mean once: as "form", or as the older "offset" and "gain", not both' });
  if (!c.form) {
    if (!c.offset && !c.gain) ctx.addIssue({ code: 'custom', path: ['form'], message: 'expected the candidate’s form: {"kind": "pi" | "schedule" | "affine", …}' });
    else if (!c.offset) ctx.addIssue({ code: 'custom', path: ['offset'], message: 'expected the offset of the affine form (one value per action)' });
    else if (!c.gain) ctx.addIssue({ code: 'custom', path: ['gain'], message: 'expected the gain of the affine form (one row per action)' });
  }
  if (c.dither && c.std) ctx.addIssue({ code: 'custom', path: ['std'], message: 'give the dither once: "dither" ("std" is its older name)' });
  if (!c.dither && !c.std) ctx.addIssue({ code: 'custom', path: ['dither'], message: 'expected the dither: the standard deviation of each action, in its unit' });
}).transform(({ name, description, form, offset, gain, dither, std, bounds, rateLimit }) => ({
  name, description,
  form: form ?? { kind: 'affine' as const, offset: offset ?? [], gain: gain ?? [] },
  dither: dither ?? std ?? [],
  ...(bounds ? { bounds } : {}),
  ...(rateLimit ? { rateLimit } : {}),
}));

export const startStatesSchema = z.discriminatedUnion('kind', [
  strictObject({ kind: z.literal('episodeStarts') }),
  strictObject({ kind: z.literal('given'), states: z.array(z.array(finite)).min(1) }),
]);

export const surfaceSchema = strictObject({
  xState: columnName,
  yState: columnName,
  resolution: z.number().int().min(SURFACE_RESOLUTION.min).max(SURFACE_RESOLUTION.max).default(SURFACE_RESOLUTION.default),
});

/** Bootstrap settings of the assessment (src/pipeline/assessSettings.ts reads them; CLI flags override). */
export const bootstrapSchema = strictObject({
  /** Episode resamples; 1000 keeps the Monte Carlo error of a 90 % percentile end small (Efron & Tibshirani 1993, §19.3). */
  resamples: z.number().int().min(BOOTSTRAP_RESAMPLES.min).max(BOOTSTRAP_RESAMPLES.max).default(BOOTSTRAP_RESAMPLES.default),
  /** Confidence level of the intervals. */
  level: finite.min(CONFIDENCE_LEVEL.min, `expected a confidence level of at least ${CONFIDENCE_LEVEL.min}`).lt(CONFIDENCE_LEVEL.below, `expected a confidence level below ${CONFIDENCE_LEVEL.below}`).default(CONFIDENCE_LEVEL.default),
});

/**
 * The last run's results, kept so reopening needs no rerun. `fingerprint` is the SHA-256 of what
 * the numbers depend on (the data file's content and every setting; the renderer's runKey.ts):
 * results whose fingerprint differs from the project's own are shown as out of date, never as
 * current. evaluation and assessment are the CLI's published JSON forms (pipeline/*Json.ts).
 */
export const resultsSchema = strictObject({
  format: z.literal(1),
  fingerprint: z.string().regex(/^[0-9a-f]{64}$/, 'expected 64 hexadecimal digits'),
  /** ISO 8601 time the results were kept. */
  savedAt: z.string(),
  evaluation: z.record(z.string(), z.unknown()),
  assessment: z.record(z.string(), z.unknown()).optional(),
  /** The retune maps computed from the same run (pipeline/retuneMaps.ts RetuneMapResult, as the CLI's --json writes them); absent in older files. */
  retuneMaps: z.array(z.record(z.string(), z.unknown())).max(MAX_RETUNE_MAPS).optional(),
});

/** One swept number of a candidate: its dotted path and the values (src/core/retune/retuneAxes.ts). */
export const retuneAxisSchema = strictObject({
  /** e.g. "form.loops.0.proportionalGain", "form.loops.0.integralTimeSeconds", "dither.0". */
  parameter: z.string().trim().min(1, 'expected the path of a number of the candidate'),
  from: finite,
  to: finite,
  count: z.number().int().min(MIN_RETUNE_AXIS_POINTS).max(MAX_RETUNE_AXIS_POINTS),
  spacing: z.enum(['linear', 'logarithmic']).default('linear'),
});

/** A retune map: one candidate evaluated over a grid of one or two of its parameters. */
export const retuneMapSchema = strictObject({
  /** The name of the candidate the map starts from. */
  candidate: z.string().trim().min(1, 'expected the name of a candidate'),
  axes: z.array(retuneAxisSchema).min(1).max(MAX_RETUNE_AXES),
});

export const projectSchema = strictObject({
  format: z.literal(PROJECT_FORMAT),
  version: z.literal(PROJECT_VERSION),
  name: z.string().trim().min(1, 'expected a project name'),
  description: z.string().default(''),
  data: dataSourceSchema,
  columns: columnRolesSchema,
  discount: finite.gt(DISCOUNT_RANGE.above, `expected a discount factor above ${DISCOUNT_RANGE.above}`).lt(DISCOUNT_RANGE.below, `expected a discount factor below ${DISCOUNT_RANGE.below}`),
  candidates: z.array(candidateSchema).min(1, 'expected at least one candidate policy').max(MAX_CANDIDATES, `at most ${MAX_CANDIDATES} candidates per project`),
  approximator: approximatorSchema,
  /** Per action dimension; with actuator limits the plan allows at most MAX_BOUNDED_NORMAL_NODES (src/core/limits.ts). */
  quadratureNodes: z.number().int().min(MIN_QUADRATURE_NODES).max(MAX_GAUSS_HERMITE_NODES).default(DEFAULT_QUADRATURE_NODES),
  seed: z.number().int().min(SEED.min).max(SEED.max).default(SEED.default),
  startStates: startStatesSchema.default({ kind: 'episodeStarts' }),
  surface: surfaceSchema.optional(),
  bootstrap: bootstrapSchema.optional(),
  retuneMaps: z.array(retuneMapSchema).max(MAX_RETUNE_MAPS).optional(),
  results: resultsSchema.optional(),
  /**
   * Free-form remarks of the user's own (any JSON: text, or an object such as
   * { "reviewedBy": "…", "comment": "…" }); never read by the program, kept as written on every save.
   */
  notes: z.unknown().optional(),
  /** Fields an older format version had and this one has no place for (migrations.ts); kept, never read. */
  carriedOver: z.record(z.string(), z.unknown()).optional(),
});

export type ProjectDocument = z.infer<typeof projectSchema>;
export type ProjectInput = z.input<typeof projectSchema>;
export type CandidateSpec = z.infer<typeof candidateSchema>;
export type CandidateForm = CandidateSpec['form'];
export type DerivedStateSpec = z.infer<typeof derivedStateSchema>;
export type RetuneMapSpec = z.infer<typeof retuneMapSchema>;
export type ColumnRoles = z.infer<typeof columnRolesSchema>;
export type CsvSettings = z.infer<typeof csvSettingsSchema>;
export type ExcludedTime = z.infer<typeof excludedTimeSchema>;
export type ExcludedRun = z.infer<typeof excludedRunSchema>;
export type BootstrapSettings = z.infer<typeof bootstrapSchema>;
export type SavedResults = z.infer<typeof resultsSchema>;
