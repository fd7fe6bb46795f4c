/** The one problem a stopped import, run, assessment or retune map ends with; hosts recognise a stop by it (the CLI's exit 130). */
import type { Problem } from '../core/result';

export const CANCELLED_PROBLEM: Problem = { where: 'evaluation', message: 'cancelled before it finished; no results were kept' };
