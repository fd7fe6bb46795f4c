/**
 * An exception that reached the worker's top level, as a problem the screen can show: typed engine
 * and query errors keep their message; anything else is named as an internal error.
 */
import type { Problem } from '../../../core/result';
import { isEngineError } from '../../../pipeline/engineErrors';
import { BehaviourModelError } from '../../../core/behaviourModel';
import { WorkerQueryError } from './workerMemory';

const CALL_NAMES: Record<string, string> = {
  setData: 'reading the data file', inspect: 'reading the data file', importData: 'importing the data', evaluate: 'the evaluation',
  surface: 'the value surface', slice: 'the action-value slice',
};

export function problemFromError(error: unknown, call: string): Problem {
  const where = CALL_NAMES[call] ?? call;
  if (isEngineError(error) || error instanceof WorkerQueryError || error instanceof BehaviourModelError) return { where, message: error.message };
  const message = error instanceof Error ? error.message : String(error);
  return { where, message: `internal error (please report it): ${message}` };
}
