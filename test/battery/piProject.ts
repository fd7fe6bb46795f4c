/** The PI loop's log read the way a user would: a project document, the import, the compile step. */
import { createFeatureMap } from '../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../src/core/features/standardiser';
import { fitLinearFqe } from '../../src/core/fqe/linearFqe';
import type { TransitionSet } from '../../src/core/transitions';
import { importDataset } from '../../src/data/importDataset';
import { candidatePolicy } from '../../src/pipeline/candidatePolicy';
import { parseProjectText } from '../../src/project/projectFile';
import type { ProjectDocument } from '../../src/project/schema';
import { PI_LOOP_DISCOUNT, PI_LOOP_PERIOD_SECONDS, PI_LOOP_SETPOINT } from './piLoop';

/** A project on the PI loop's CSV; `previous` adds the previous heater output as a third state. */
export function piLoopProject(candidates: unknown[], previous = false, degree = 2): ProjectDocument {
  const text = JSON.stringify({
    format: 'setpoint-critic-project', version: 1, name: 'PI loop', data: { path: 'pi.csv' },
    columns: {
      states: [{ column: 'temp_c', unit: '°C' }, { column: 'temp_integral', unit: 'K·s' }, ...(previous ? [{ column: 'heater_prev', unit: '%' }] : [])],
      actions: [{ column: 'heater_pct', unit: '%' }],
      reward: { kind: 'column', column: 'cost', sense: 'cost' },
      episode: { kind: 'column', column: 'run' },
      derived: [
        { kind: 'errorIntegral', name: 'temp_integral', unit: 'K·s', measurement: 'temp_c', setpoint: PI_LOOP_SETPOINT, initial: 0, periodSeconds: PI_LOOP_PERIOD_SECONDS },
        ...(previous ? [{ kind: 'previous', name: 'heater_prev', unit: '%', source: 'heater_pct' }] : []),
      ],
    },
    discount: PI_LOOP_DISCOUNT, candidates,
    approximator: { kind: 'linear', features: { kind: 'polynomial', degree }, ridge: 0, tolerance: 1e-12 },
  });
  const parsed = parseProjectText(text, 'pi.spcritic');
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => `${p.where}: ${p.message}`).join('\n'));
  return parsed.value.document;
}

export function piLoopData(project: ProjectDocument, csv: string): TransitionSet {
  const result = importDataset(csv, 'pi.csv', project.data.csv, project.columns);
  if (!result.ok) throw new Error(result.problems.map((p) => `${p.where}: ${p.message}`).join('\n'));
  return result.value.transitions;
}

/** Linear FQE of candidate i with polynomial features of the project's degree; J in reward sense. */
export function piLoopFqe(project: ProjectDocument, data: TransitionSet, i: number): { value: number; fixedPoint: number; status: string } {
  const degree = project.approximator.kind === 'linear' && project.approximator.features.kind === 'polynomial' ? project.approximator.features.degree : 2;
  const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, degree));
  const policy = candidatePolicy(project.candidates[i], data);
  const fit = fitLinearFqe({ data, policy, features, discount: project.discount, ridge: 0, quadratureNodes: 10, tolerance: 1e-12, maxIterations: 5000 });
  return { value: fit.iterative?.policyValue.value ?? NaN, fixedPoint: fit.fixedPoint?.policyValue.value ?? NaN, status: fit.status };
}
