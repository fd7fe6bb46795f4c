/**
 * Every limit and default of the engine, in one place. The project schema, the evaluation plan
 * and the numerics import them from here, so that a value the schema accepts is one the engine
 * can run, and a limit changed here changes everywhere at once.
 *
 * Where a limit is a property of a method (the largest quadrature rule that keeps its accuracy)
 * the reason is given beside it; where it is a budget (work or memory a desktop can afford) it is
 * marked as ours.
 */

/** State columns of a project (dense least squares in polynomial features grows fast with them; ours). */
export const MAX_STATE_COLUMNS = 10;
/**
 * Rows back a derived previous value may reach (`steps`). A value k rows back is Markov only with
 * the values 1 … k − 1 rows back among the states, so k cannot usefully exceed the state columns.
 */
export const MAX_PREVIOUS_STEPS = MAX_STATE_COLUMNS;
/** Action columns: tensor-product quadrature has n^m points per state, so m stays small (ours). */
export const MAX_ACTION_COLUMNS = 3;

/** The discount factor γ lies strictly between these (γ = 1 has no discounted value in general). */
export const DISCOUNT_RANGE = { above: 0, below: 1 } as const;

/**
 * Gauss–Hermite nodes per action dimension: the rule is built by Golub–Welsch with Newton polish,
 * verified to 64 nodes (src/core/quadrature/gaussHermite.ts).
 */
export const MAX_GAUSS_HERMITE_NODES = 64;
/**
 * Interior nodes per action dimension of the bounded-normal rule (clipped or truncated actions):
 * its discretised Stieltjes procedure keeps full accuracy to 32 nodes (boundedNormal.ts).
 */
export const MAX_BOUNDED_NORMAL_NODES = 32;
/** Fewest nodes per action a project may set: one node puts the action at the policy's mean (a rule exact to degree 1). The schema and the engine's check both read it. */
export const MIN_QUADRATURE_NODES = 1;
export const DEFAULT_QUADRATURE_NODES = 10;
/**
 * Quadrature points per state (n^m, or (n + 2)^m with clipped limits). Every data pass evaluates
 * the features at each point of each next state, so this bounds its cost (ours: 4,096 is 16 nodes
 * in each of three actions).
 */
export const MAX_QUADRATURE_POINTS = 4096;
/**
 * Largest rounding-error bound, relative to max(1, |E z^k|), at which a clipped action's moments are
 * taken in closed form (actionMoments.ts); above it (a dither far wider than the band between the
 * limits, whose interior terms cancel) the bounded-normal rule gives them. Ours: the bound runs
 * 10–100× above the error measured against that rule, so 1e−11 keeps the closed form to about
 * 1e−12, and in closed form for every dither up to the logged actions' spread (τ ≤ 1, degree ≤ 6,
 * on a grid of means and limits).
 */
export const CLIPPED_MOMENT_TOLERANCE = 1e-11;

/** Breakpoints of one scheduled loop (a lookup table of the input; more than this is a curve, better written as an expression; ours). */
export const MAX_SCHEDULE_BREAKPOINTS = 50;
/** States computed from the log during import (each is an expression evaluated on every row; ours). */
export const MAX_DERIVED_STATES = 10;
/** Retune maps per project, and kept with its saved results (each is a grid of fits; ours). */
export const MAX_RETUNE_MAPS = 10;
/** Candidates per project (each is a fit and, in the assessment, a series of resamples; ours). */
export const MAX_CANDIDATES = 100;

/** Polynomial feature degree and radial-basis centres per input accepted by the schema. */
export const POLYNOMIAL_DEGREE_RANGE = { min: 1, max: 6 } as const;
/**
 * Degree of the linear approximator's default features (full polynomial in the standardised state
 * and action): the smallest degree whose class holds the exact Q of a linear-quadratic plant (ours;
 * common practice for such plants). New projects, the retune map's fallback and the linear estimate
 * the network is compared with (src/core/fqe/networkComparator.ts) all take it from here.
 */
export const DEFAULT_POLYNOMIAL_DEGREE = 2;
export const RADIAL_CENTRES_RANGE = { min: 2, max: 12 } as const;
/** Dense least squares is O(d³) per solve; beyond this many features a fit would not finish on a desktop. */
export const MAX_FEATURES = 2000;
/**
 * The network's per-project choice of its polynomial part's degree (src/core/fqe/networkDegreeChoice.ts)
 * costs n·d² multiply-adds in the quartic's d features, on every fit that asks for it; above this many
 * features it is not run and the default degree is kept, with the reason in the fit's message.
 * 126 = a quartic in 5 inputs, the largest class on the battery (the 4-state plant), where the choice
 * was measured by the adoption rule (test/battery/README.md). Cost per 100,000 rows with the block
 * products (degreeChoiceSums.ts), a loaded 2-core machine: 0.2–0.6 s at 35 features, 1.1–1.2 s at 126
 * (6.3× faster than the row loop before them); the pipe heater's 7 inputs (330 features) 7.4 s (it took
 * 460–650 s before, on a machine loaded by three sweeps) — a large share of a network fit, for a class
 * the rule never measured.
 */
export const DEGREE_CHOICE_MAX_FEATURES = 126;

/**
 * Ridge λ per sample on the averaged normal equations of standardised features (ridgeSystem.ts).
 * The features' second moments are of order 1, so λ well above 1 shrinks every weight towards zero
 * and the value towards the reward's mean: 10 is far beyond any useful setting (ours).
 */
export const RIDGE = { default: 1e-6, max: 10 } as const;
/**
 * Relative weight change at which the linear FQE iteration stops. Below about 1e-14 round-off in
 * the O(d²) update is larger than the change asked for, so the iteration could never stop (ours).
 */
export const TOLERANCE = { default: 1e-10, min: 1e-14, max: 1e-2 } as const;
export const MAX_ITERATIONS = { default: 5000, min: 1, max: 1_000_000 } as const;

/**
 * A linear fit's bootstrap reweights per-episode sums (3d² + 2d + 2 numbers per episode) when there
 * are at most this many of them in all: then a resample costs about a millisecond and the sums a
 * few megabytes. Above it (many episodes, or many features) each resample is taken to first order
 * instead, at O(e) per resample (src/core/bootstrap/linearisedReplicate.ts; ours).
 */
export const MAX_EXACT_RESAMPLE_VALUES = 2 ** 20;

/**
 * Above MAX_EXACT_RESAMPLE_VALUES, the per-episode sums are still formed in the fit's one pass when
 * there are at most this many (64 MiB of doubles, held only until the fit is solved): the first-order
 * resamples' influence values then follow from them by algebra, with no second pass over the data
 * (src/core/bootstrap/linearisedReplicate.ts, linearisedReplicatesFromSums; ours).
 */
export const MAX_INFLUENCE_SUM_VALUES = 2 ** 23;

/**
 * The fitted V̂ is compared with the possible range (src/core/diagnostics/possibleStateValues.ts) at
 * up to this many logged states, taken at an even stride through the log: the median of 20,000
 * states has a sampling error near 0.9 % of the states' own spread (√(π/2)/√n for a normal law;
 * common practice), and a network's V̂ there costs well under a second.
 */
export const MAX_VALUE_CHECK_STATES = 20_000;

/**
 * Logged transitions at most in the end-chance model's regression (offPolicy/endChanceModel.ts): a
 * larger log keeps every end (up to half of these) and an even stride of the other rows, each
 * weighted by its class's sampling ratio, which leaves the likelihood's expectation unchanged
 * (case-control sampling with weights; King & Zeng, "Logistic regression in rare events data",
 * Political Analysis 2001). Every Newton step is a pass of rows × features² multiply-adds, some
 * hundred passes with the rollout resamples: at 10⁵ rows and 28 features, well under ten seconds.
 */
export const END_MODEL_ROWS = 100_000;

/** Value-surface grid points per axis. */
export const SURFACE_RESOLUTION = { default: 60, min: 2, max: 400 } as const;

/** Random seeds are unsigned 32-bit integers (src/core/random.ts). */
export const SEED = { default: 1, min: 0, max: 2 ** 32 - 1 } as const;

/**
 * Bootstrap resamples over episodes: 1000 keeps the Monte Carlo error of a 90 % percentile
 * endpoint near 0.03 standard errors of the estimate (Efron & Tibshirani 1993, §19.3, recommend
 * B ≥ 1000 for percentile intervals; common practice). At least 20 give any spread at all.
 */
export const BOOTSTRAP_RESAMPLES = { default: 1000, min: 20, max: 100_000 } as const;
/**
 * How the resamples take the weighted per-decision checks (importance sampling, doubly robust):
 * 'resampled' recomputes each check on every resample; 'firstOrder' takes it to first order in the
 * run multiplicities (offPolicy/perDecisionDerivatives.ts), O(data) once instead of O(resamples × data).
 * The default is the one the battery's rule chose (test/battery/README.md, "First-order standard errors
 * of the per-decision checks").
 */
export const PER_DECISION_RESAMPLING = { default: 'resampled', routes: ['resampled', 'firstOrder'] } as const;
export type PerDecisionResampling = (typeof PER_DECISION_RESAMPLING.routes)[number];
/** Confidence level of the intervals. */
export const CONFIDENCE_LEVEL = { default: 0.9, min: 0.5, below: 1 } as const;
/** Fewest logged runs (episodes) the bootstrap resamples: fewer give intervals too coarse to mean much (common practice). */
export const MIN_EPISODES = 10;

/**
 * The effective horizon 1/(1 − γ) in logged steps may not exceed the number of logged
 * transitions: a value that weighs the future over more steps than the logs hold in all is an
 * extrapolation of the fitted model, not an estimate from the data (ours).
 */
export function horizonSteps(discount: number): number {
  return 1 / (1 - discount);
}

/**
 * A run label: at most this many characters, counted as Unicode code points (`runLabelLength` in
 * core/runLabelText.ts) — what a person sees as one character in most scripts: an emoji or a
 * mathematical letter such as 𝑥 is one, though a JS string counts it as two UTF-16 code units and
 * UTF-8 writes it in four bytes. The same count for a run column's cell (src/data/columnSink.ts;
 * longer is a bad cell) and a label named in data.csv.excludedRuns (the schema), so every label the
 * import reads can be named (ours).
 */
export const MAX_RUN_LABEL_LENGTH = 1024;
/**
 * A run column's cell longer than this in the file's bytes is not decoded: no label of
 * MAX_RUN_LABEL_LENGTH code points takes more in UTF-8 (at most 4 bytes each, RFC 3629 §3; a doubled
 * quote of a quoted cell is 2 bytes for 1), blanks around it aside.
 */
export const MAX_RUN_LABEL_BYTES = 4 * MAX_RUN_LABEL_LENGTH;
/** Ranges of runs a project leaves out (data.csv.excludedRuns; ours, as for time windows left out). */
export const MAX_RUN_RANGES_LEFT_OUT = 100;

/**
 * A reward/cost expression (src/data/expressionSyntax.ts): a plant's formula is a few terms over a
 * few columns, and these bounds are two orders of magnitude above that while keeping the recursive
 * parser and the column-wise evaluation (one n-long array per operation) far from any stack or
 * memory limit (ours). Characters of its text; nesting of parentheses, functions, signs and powers;
 * operations (operators and function calls) in all.
 */
export const MAX_EXPRESSION_LENGTH = 2000;
export const MAX_EXPRESSION_DEPTH = 40;
export const MAX_EXPRESSION_OPERATIONS = 200;

/**
 * A data file at least this large is read in pieces (the command line; ours): its bytes are never
 * held whole, so the import's peak memory is the columns and the transitions, not the file as well.
 * A smaller file is read whole, as before.
 */
export const STREAMED_FILE_BYTES = 16 * 1024 * 1024;
/** The window of a file read in pieces: the bytes held at once while its records are read (ours; it grows only for a record longer than it). */
export const STREAM_WINDOW_BYTES = 4 * 1024 * 1024;

/**
 * The plant-memory check (diagnostics/plantMemory.ts): earlier rows read back, and the rows regressed
 * at most. Eight rows back lets a dead time of several samples show (ours); a larger log is read at
 * an even stride of its usable rows, deterministic, so the check's cost stays a few tenths of a
 * second at any size (rows × (monomials + 8·(states + actions))² / 2 multiply-adds).
 */
export const PLANT_MEMORY_LAGS = 8;
export const PLANT_MEMORY_ROWS = 20_000;
/**
 * The run-order check (diagnostics/runOrder.ts, runOrderFinding.ts): the family-wise level of its
 * Bonferroni-corrected Spearman trend tests, chosen on the battery by the rule in
 * test/battery/README.md ("Run order"); and the fewest fitted runs it reads (ours: below ten the
 * normal approximation of Spearman's ρ is poor).
 */
/** Column-pivot floor of the whole-log regressions (diagnostics/plantMemory.ts, diagnostics/runOrder.ts): a pivot below this share of its column's own sum of squares is rounding (ours). */
export const PIVOT_FLOOR = 1e-10;
export const RUN_ORDER_ALPHA = 1e-3;
export const RUN_ORDER_MIN_RUNS = 10;
/**
 * A step is CLEAR (diagnostics/changeShape.ts) when the best single step's residual sum of squares on the ranks is at
 * most this share of the straight line's. Only a clear step earns the advice to leave out the runs before it, and only
 * clear steps let runs left out resolve a change (diagnostics/runsLeftOutReading.ts). On ranks a perfect step at the
 * middle leaves about 0.57 (closed form), a straight line far above 1. Chosen by the rule written before measuring
 * (/work/notes/clearstep38-rule.md): the largest share at which at most 5 % of significant noisy linear drifts read
 * as clear steps in every cell of its grid; test/battery/README.md, "A step clear enough to cut at".
 */
export const CLEAR_STEP_SHARE = 0.75;
/**
 * Where a changed coefficient drifted steadily (diagnostics/changeShape.ts), the share of the latest runs that
 * bench/keptRuns.ts keeps to show what evaluating them alone gives. The words suggested it until memory38; they
 * no longer do (runOrderChangeWords.ts: it narrows the gap, it does not close it). Ours, not chosen on data;
 * what it gives on the wearing pump: test/battery/README.md, "Where the log changed".
 */
export const DRIFT_RECENT_SHARE = 1 / 3;
/** Largest monomial count of the plant-memory check's base regression (pipeline/plantMemoryCheck.ts memoryBaseDegree; ours, the rollout model's own cap). */
export const PLANT_MEMORY_BASE_MONOMIALS = 120;

/**
 * The smallest share (of action probability, of weights) written as a number: 0.01 %. A positive
 * share below it is written "below 0.01 %" — "5.74e−6 %" told the engineer nothing more (a display
 * choice, from the screen review).
 */
export const SMALLEST_SHARE_SHOWN = 1e-4;

/**
 * Significant digits an editable number field shows: 15, the most at which every decimal text a
 * person or a script writes reads back to the same double (IEEE 754-2008 §5.12.2: a decimal string of
 * at most 15 significant digits survives a round trip through binary64). A script's 0.1 + 0.2 is
 * shown "0.3", not "0.30000000000000004"; the field writes the document only when the user edits it,
 * so the stored value is kept as it was.
 */
export const EDITABLE_DIGITS = 15;

/** Resamples a discount sweep's changes are checked on (pipeline/assessSweepCheck.ts; ours: the first of the assessment's own; a 90 % percentile end to about a tenth of the interval's width). */
export const SWEEP_CHECK_RESAMPLES = 200;
/** Fewest resamples with a value at both discounts for a pair of them to be checked (ours: below it a 90 % percentile end rests on too few replicates). */
export const SWEEP_CHECK_MIN_PAIRED = 100;
/**
 * Most work, in multiply-adds counted by core/bootstrap/solveWork.ts, one candidate's sweep check may run
 * (pipeline/assessSweepCheck.ts): about one second of one core's CPU time. The rate is the median, over the
 * battery's and samples' checks that run at least 1e8 (where a check's fixed costs are negligible), of the
 * units a check runs per CPU second: 3.4e8, rounded down to one significant figure (ours). A first size,
 * 1e8, was converted by wall-clock seconds on a loaded machine, which made it 0.3–0.5 s. The rules, written
 * before measuring, and their tables: test/battery/README.md, "The sweep check's budget".
 */
export const SWEEP_CHECK_BUDGET = 3e8;

/**
 * Two J of a sweep are tied, and rank neither above the other, when they differ by at most this share
 * of the larger magnitude, or of the size of the terms they sum where J is nearer 0 than that
 * (core/rankingTie.ts, which says why the scale must not vanish; pipeline/sweepRanking.ts). The ranking's words name no J, only which
 * policy "ranks above" which, so the rule is about the numbers themselves, not how a figure prints
 * them: two J of the same value reached by sums in another order lie a few units in the last place
 * apart (0.1 + 0.2 against 0.3: a relative 1.9e−16), and a sort that put one of them first named a
 * turn that was rounding. Ours: 1e−9 lies well above the rounding of float64 sums (recursive summation
 * errs by at most about n·2^−53 of Σ|xᵢ|, Higham, "Accuracy and Stability of Numerical Algorithms",
 * 2nd ed., §4.2, quoted from memory: 1.1e−11 for 100,000 rows) and far below the sampling error of any J the app reports.
 * A rule at the figure's 4 significant digits would call a real 0.04 % gap a tie, and is not
 * consistent (1.2344 and 1.2346 print apart, 1.2346 and 1.2354, four times as far apart, alike).
 */
export const RANKING_TIE_RELATIVE = 1e-9;

/**
 * Where a retune map's time axis (an integral time, kept in seconds) changes the unit it is shown in,
 * by the axis's largest value in seconds (figures/parts/tuningAxis.ts `shownTimeUnit`; rule:
 * /work/notes/axis38-rule.md): minutes from 10 min (600 s) on, hours above 10 h (36,000 s; 10 h
 * itself stays in minutes). Common practice: integral times are read in minutes, seconds for fast
 * loops; the two ends are ours.
 */
export const TIME_AXIS_MINUTES_FROM_SECONDS = 600;
export const TIME_AXIS_HOURS_ABOVE_SECONDS = 36_000;

/**
 * The run-trend forecast of J at the end of a drifting log (drift/runBlocks.ts, drift/runBlockValues.ts; measured
 * by the rule written before measuring, /work/notes/drift40-rule.md; test/battery/README.md, "A forecast of the end
 * of a drifting log"): the runs split in run order into `blocks` consecutive blocks of at least `minBlockRuns` runs
 * each (fewer blocks when the log is short; below `fewestBlocks` no forecast: the line's scale needs K − 2 ≥ 1
 * degrees of freedom), each block's sampling variance from `resamples` bootstrap resamples of its own runs. Ours.
 */
export const DRIFT_FORECAST = { blocks: 5, minBlockRuns: 20, fewestBlocks: 3, resamples: 200 } as const;
