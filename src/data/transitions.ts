/** Re-export: the transition set type lives in core (estimators take it); data produces it. */
export type { TransitionSet } from '../core/transitions';
