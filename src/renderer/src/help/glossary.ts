/**
 * The terms a user meets, each in one line: the trade's own terms where it has them, plain coined
 * names for the rest, and the method names a reviewer needs, explained once. Terms are rich text
 * (V^{π}: superscript; E_{a~π}: subscript) so they are typeset as written in the literature.
 */
import { CHOICE_STANDARD_ERRORS } from '../../../core/fqe/networkDegreeChoice';
import { HORIZON_FORMULA } from '../../../core/formulaText';

export interface GlossaryEntry {
  term: string;
  /** Other names the same thing goes by (the literature's, or ours elsewhere). */
  aka?: string;
  meaning: string;
}

export const GLOSSARY: readonly GlossaryEntry[] = [
  { term: 'Present controller', aka: 'behaviour policy, in the off-policy literature', meaning: 'The controller that ran while the log was recorded, as modelled from the log (gain, offset, dither and the actuator limits seen) and evaluated like any candidate.' },
  { term: 'Logged return', meaning: 'The discounted cost the log itself earned, averaged over the runs: read straight off the log, no model. Shown beside the present controller as a check; cut short where a run ends on a time limit.' },
  { term: 'Baseline', meaning: 'What every candidate is compared with: the present controller, or the logged return where no model of the present controller could be fitted.' },
  { term: 'Candidate', aka: 'target policy', meaning: 'A retune to judge before it touches the plant: a mean action (offset plus a gain on each state), a dither around it, and optional actuator limits.' },
  { term: 'Run', aka: 'episode, batch', meaning: 'A stretch of the log recorded without a break; discounted costs are summed within a run, never across two.' },
  { term: 'Logged step', aka: 'transition', meaning: 'One row of the log with the next: state, action, cost, and the state that followed.' },
  { term: 'Dither', aka: 'exploration noise, policy standard deviation', meaning: 'How far a candidate’s action wanders around its mean (one standard deviation of a Gaussian). The log must hold actions like it for the estimate to rest on data.' },
  { term: 'Actuator limit', meaning: 'The lowest and highest action the actuator can take. Clip: the action sits at the limit. Truncate: the candidate never asks beyond it.' },
  { term: 'Discount factor γ', meaning: `Weight of a cost one logged step later. ${HORIZON_FORMULA} steps is the horizon it looks over; with the sampling period that is a time.` },
  { term: 'J', aka: 'policy value', meaning: 'A candidate’s expected discounted cost from the start states on, in the cost’s own unit, discounted. Lower is better for a cost.' },
  { term: 'V^{π}(s)', aka: 'state value', meaning: 'The expected discounted cost from state s on under candidate π. J is its mean over the start states.' },
  { term: 'Q^{π}(s, a)', aka: 'action value, Q-function', meaning: 'The expected discounted cost of taking action a in state s, then following candidate π.' },
  { term: 'E_{a~π}[Q^{π}(s, a)]', meaning: 'The average of Q over the candidate’s actions at s (its mean and dither): that average is V^{π}(s).' },
  { term: 'Fitted Q-evaluation', aka: 'FQE', meaning: 'The method: Q^{π} is fitted to the logged steps by repeated least squares, each time against the cost plus γ times the averaged Q of the next state.' },
  { term: 'Gauss–Hermite nodes', meaning: 'The points at which Q is averaged over a Gaussian action, with their weights (a quadrature rule; exact for polynomials up to twice the node count).' },
  { term: 'One-step mismatch', aka: 'Bellman residual, temporal-difference error', meaning: 'How far the fitted Q misses cost + γ × next Q on the logged steps, as a mean square. It should fall and level off as the fit converges.' },
  { term: 'J by direct solve', aka: 'fixed point, LSTD-Q', meaning: 'J from solving the fit’s equations in one step instead of iterating; it should match J from the iterated fit.' },
  { term: 'Weight penalty', aka: 'ridge', meaning: 'A small penalty on the fitted weights that keeps the least-squares solve well posed.' },
  { term: 'Bootstrap interval', meaning: 'The range J falls in when whole runs of the log are drawn again at random and the fit repeated; percentile and basic intervals are two ways to read the resamples.' },
  { term: 'Paired difference', meaning: 'J of one policy minus J of another on the same resamples, so luck in which runs were logged cancels.' },
  { term: 'Cross-checks', aka: 'importance sampling, doubly robust, model check', meaning: 'Other estimates of the same J under other assumptions. Agreement is evidence; disagreement is a reason to look closer.' },
  { term: 'Findings table', meaning: 'The table at the top of Coverage: a row for the whole log, each candidate and the present controller, a column for each kind of check that raised something, and in each cell serious, caution or — for none. A mark links to its sentence below; a column’s title, held under the pointer, says what it checks.' },
  { term: 'Occupancy shift', meaning: 'How far the states and actions a candidate would visit (discounted, from the start states) lie from the logged ones, in the fit’s own terms; 1 means like the logs. The estimate’s error grows with its square root.' },
  { term: 'Polynomial part', meaning: `The polynomial in the states and actions that a network’s Q starts from; the network’s hidden layers learn what it misses. Its degree is 2, or 4 where 4 predicts the present controller’s held-out runs better by more than ${CHOICE_STANDARD_ERRORS} standard errors and J’s start states lie inside the logs; the Estimator step can fix it at 2 or 4 instead.` },
  { term: 'Function classes', meaning: 'The same candidate fitted with polynomial features of several degrees. When they disagree beyond sampling error, or when no other class is precise enough to see a gap of 10 % of J, the estimate is “not settled” and the range spanning them is reported.' },
  { term: 'Range to report', meaning: 'The number to carry forward for a candidate that is not settled: the span of every function class’s interval, cut where the cost’s definition (never below or above a value on any row) puts values out of reach of every policy.' },
  { term: 'Effective sample size', meaning: 'How many logged steps or runs the reweighted log is worth for a candidate; few means noisy cross-checks.' },
  { term: 'Censored fit', aka: 'censored regression, Tobit model', meaning: 'How the present controller is fitted where the log shows an actuator limit: a step at the limit counts as “asked for the limit or beyond”, not as the action itself, so the steps spent saturated do not bend the fitted gains.' },
  { term: 'Dithers that move together', meaning: 'With several actions, the present controller’s variations on two of them can be correlated (both following one noisy measurement, say). Its model clips each action at its own limits and so takes them as independent; a caution names the pair when the correlation is large and clearly not chance.' },
  { term: 'Plant memory', meaning: 'Whether earlier rows still explain the next state once the present state and action are known. If they do, the state columns miss part of what the plant remembers, which every estimate here assumes away.' },
  { term: 'Crossed point', meaning: 'A J on the discount sweep at odds with J at another swept discount: between the two, J changes by an amount the per-step costs or rewards cannot make (with costs that are never negative, J can only grow as the horizon grows), on paired resamples of the runs, so the two cannot both be right. The crosses are the fewest points that account for every such pair; the ranking verdict leaves their discounts out, the candidate’s warnings say by how much, and a pair holding the project’s own discount is serious.' },
  { term: 'Retune map', meaning: 'J of one candidate over a grid of its settings (proportional gain and integral time), each point a full estimate with its interval, shaded where the logs no longer support it.' },
  { term: 'Unvisited cells', meaning: 'Cells of a value surface with no logged state nearest them: there the value is extrapolated, not measured.' },
];
