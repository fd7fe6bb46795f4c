/**
 * The engine's typed errors: each carries a message written for the user (naming the field or value
 * at fault), so the pipeline reports it as a problem. Anything else is a bug and is rethrown.
 */
import { FeatureSpecError } from '../core/features/featureSpecError';
import { FqeDataError, FqeOptionsError } from '../core/fqe/fqeErrors';
import { SingularMatrixError } from '../core/linalg/dense';
import { PolicyError } from '../core/policy';
import { ValueQueryError } from '../core/value';
import { NetworkDivergedError, TfBackendError } from '../core/fqe/networkErrors';

const ENGINE_ERRORS = [PolicyError, FeatureSpecError, FqeDataError, FqeOptionsError, SingularMatrixError, ValueQueryError, NetworkDivergedError, TfBackendError];

export function isEngineError(e: unknown): e is Error {
  return ENGINE_ERRORS.some((type) => e instanceof type);
}
