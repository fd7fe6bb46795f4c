/**
 * The columns of the findings matrix (findingMatrix.ts): every warning topic (AssessmentWarning.topic)
 * in one column with a short plain title, the app's Coverage panel and the report's Diagnostics alike.
 * A candidate's topic and the present controller's counterpart share a column (its function classes
 * not settled, its cross-checks contradicting or unconfirmed), so one column reads down every row.
 *
 * The order is the columns' order on screen, a stated choice: first where a candidate would take the
 * plant and whether the logs can weigh it (coverage), then whether its value holds (fit and checks),
 * then what bears on the log as a whole. test/pipeline/findingTopicWords.test.ts reads every topic
 * key written in src/ and fails on one without a column here, so no topic ships untitled. Titles ours.
 *
 * A title is a word or two and never wraps (the app and the report set it on one line), so the
 * matrix reads across a 1280-pixel window with no title on two or three lines (the samples' pictures:
 * test/e2e/coverageReview.test.ts). Its full meaning is the header's tooltip and its description for a screen
 * reader (`meaning`), so a short title loses nothing.
 */

export interface FindingColumn {
  /** Stable key (the anchor and the test's handle). */
  readonly key: string;
  /** The short title at the head of the column: a word or two, set on one line (at most TITLE_CHARACTERS); `meaning` says the rest. */
  readonly title: string;
  /** One line on what the column holds (the title attribute, the glossary). */
  readonly meaning: string;
  /** The warning topics this column holds. */
  readonly topics: readonly string[];
}

/** The longest a column's title may be, in characters (the test holds every title to it). */
export const TITLE_CHARACTERS = 16;

export const FINDING_COLUMNS: readonly FindingColumn[] = [
  { key: 'whereItRuns', title: 'Where it runs', meaning: 'occupancy shift: how far from the logged states the candidate would take the plant', topics: ['occupancyShift'] },
  { key: 'weightSpread', title: 'Weight spread', meaning: 'importance weights: how few runs carry the weight the logs give the candidate', topics: ['importanceWeights'] },
  { key: 'actionsOutside', title: 'Unlogged actions', meaning: 'action support: how often the candidate would act outside the logged range near a state', topics: ['actionSupport'] },
  { key: 'fitClasses', title: 'Fit classes', meaning: 'whether J is settled across function classes (the candidate’s, or the present controller’s)', topics: ['functionClass', 'baselineNotSettled'] },
  { key: 'networkBesideLinear', title: 'Network check', meaning: 'whether the network’s J and the linear estimate beside it agree', topics: ['approximatorAgreement'] },
  { key: 'crossChecks', title: 'Cross-checks', meaning: 'whether an independent method contradicts J, or none can confirm it', topics: ['crossCheck', 'baselineContradicted', 'confirmation', 'baselineUnconfirmed'] },
  { key: 'possibleValues', title: 'Reachable J', meaning: 'whether J or its interval lies where no policy can reach with the logged costs or rewards', topics: ['impossibleValue'] },
  { key: 'discountRange', title: 'Discounts', meaning: 'whether J changes between swept discounts by more than the costs or rewards allow', topics: ['discountSweep'] },
  { key: 'intervals', title: 'Intervals', meaning: 'how far the bootstrap intervals can be read: failed resamples, skew, the network’s resampling', topics: ['bootstrap'] },
  { key: 'startStates', title: 'Start states', meaning: 'the start states J is taken at: given in the project, and whether the logs reach them', topics: ['startStates', 'startCoverage'] },
  { key: 'unloggedGrid', title: 'Unlogged grid', meaning: 'the share of the value-surface grid with no logged state near it', topics: ['unvisited'] },
  { key: 'baseline', title: 'Baseline', meaning: 'what the candidates are compared with: the present controller’s model, or the logged return in its place', topics: ['presentController', 'loggedReturn'] },
  { key: 'fewRuns', title: 'Costly runs', meaning: 'how much of the logged return the costliest tenth of the runs holds', topics: ['runConcentration'] },
  { key: 'plantMemory', title: 'Plant memory', meaning: 'whether the logged state carries the plant’s memory, or earlier rows explain the next step', topics: ['plantMemory'] },
  { key: 'heldActions', title: 'Held actions', meaning: 'whether rows that repeat the action of the row before exactly (a loop in manual, a held signal) pull the present controller’s fitted law', topics: ['heldActions'] },
  { key: 'runOrder', title: 'Run order', meaning: 'whether the plant or its controller changed over the runs in file order', topics: ['runOrder'] },
];

/** Where a topic no column names lands (never expected: the test above fails first), so a new topic is still shown. */
export const OTHER_COLUMN: FindingColumn = { key: 'other', title: 'Other', meaning: 'a finding of a kind this table has no column for', topics: [] };

/** The column a topic belongs in. */
export function findingColumnOf(topic: string): FindingColumn {
  return FINDING_COLUMNS.find((c) => c.topics.includes(topic)) ?? OTHER_COLUMN;
}
