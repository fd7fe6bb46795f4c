/** One line of explanation for every estimator setting, in the words of the trade. */
import { CHOICE_STANDARD_ERRORS } from '../../../../core/fqe/networkDegreeChoice';
import { NETWORK_LIMITS as L } from '../../../../core/fqe/networkSettings';
import { BOOTSTRAP_RESAMPLES, CONFIDENCE_LEVEL } from '../../../../core/limits';
import { formulaText, HORIZON_FORMULA } from '../../../../core/formulaText';

export const SETTING_HELP = {
  discount: `Weight of a cost or reward one step later (${formulaText('0 < γ < 1')}); 0.95 looks about 20 steps ahead (${HORIZON_FORMULA}).`,
  approximator: 'How Q(s, a) is represented: linear in fixed features (fast, exact fixed point) or a small neural network (flexible, slower).',
  featureKind: 'Polynomials in the standardised states and actions, or Gaussian bumps on a grid over them.',
  degree: 'Highest total power of the features; 2 represents a quadratic cost around a linear plant exactly.',
  centresPerInput: 'Bump centres per standardised input (the grid has this many to the power of the inputs).',
  widthScale: 'Width of each bump as a multiple of the spacing between centres.',
  ridge: 'Small penalty on the fitted weights (ridge regression) that keeps the least-squares solve well posed; raise it if a fit reports a singular system.',
  tolerance: 'The iteration stops when the relative change of the weights falls below this.',
  maxIterations: 'The iteration gives up after this many steps (the fixed-point solve is reported either way).',
  hiddenLayers: `Units per hidden layer, input side first, separated by commas (${L.hiddenLayers.min}–${L.hiddenLayers.max} layers of ${L.units.min}–${L.units.max} units).`,
  activation: 'Nonlinearity between layers.',
  polynomialDegree: `The polynomial the network starts from and corrects. Chosen: degree 4 where it predicts the present controller’s held-out runs better (by more than ${CHOICE_STANDARD_ERRORS} standard errors), else 2; always 2 when J’s start states lie outside the logs.`,
  learningRate: 'Step size of the Adam optimiser.',
  batchSize: 'Transitions per gradient step.',
  stepsPerIteration: 'Gradient steps towards each outer iteration’s Bellman targets (held fixed during those steps).',
  outerIterations: 'At most this many outer iterations; each solves the output layer over the whole horizon and moves the network towards new Bellman targets. The stopping rule usually ends the fit sooner.',
  heldOutFraction: 'Share of whole runs kept out of training to report the one-step mismatch on runs the fit has not seen; a diagnostic only, it never stops the fit (0 = none).',
  patience: 'Stopping rule: J and Q at fixed logged points are averaged over windows of this many outer iterations; the fit says “converged” once two windows in a row differ so little that, at this discount, at most the stopping tolerance of the value can still be moving (never before two full windows). 0 = never stop early.',
  networkTolerance: 'Largest share of the value that may still be moving when the fit says “converged” (0.01 = 1 %).',
  averageLast: 'The reported network averages the weights of the last k outer iterations, which evens out the noise of the gradient steps (1 = no averaging).',
  backend: 'How the network is computed: WebAssembly where it loads and passes its check, else plain JavaScript. The numbers agree to rounding.',
  quadratureNodes: 'Points per action at which Q is averaged over the candidate’s dither (Gauss–Hermite rule); 10 is plenty for smooth Q.',
  seed: 'Random seed; the same seed, data and settings give the same numbers.',
  bootstrap: 'After each run, whole runs of the log are drawn again at random with replacement and the fit repeated (the bootstrap), giving intervals, paired comparisons and how often the ranking holds.',
  resamples: `How many times the runs are drawn again (${BOOTSTRAP_RESAMPLES.min}–${BOOTSTRAP_RESAMPLES.max.toLocaleString('en-US')}); ${BOOTSTRAP_RESAMPLES.default.toLocaleString('en-US')} steadies the interval ends, 200 is enough for a first look.`,
  level: `Share of resamples the interval covers (${CONFIDENCE_LEVEL.min} to below ${CONFIDENCE_LEVEL.below}); ${CONFIDENCE_LEVEL.default} gives a ${CONFIDENCE_LEVEL.default * 100} % interval.`,
  startStates: 'J averages V over the first state of every logged run.',
} as const;
