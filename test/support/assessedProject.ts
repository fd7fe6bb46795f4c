/** A project's assessment for tests, or the pipeline's problems thrown as one error (a test set-up that must not fail quietly). */
import { assessProject } from '../../src/pipeline/assessProject';
import type { Assessment } from '../../src/pipeline/assessment';

export async function assessedProject(options: Parameters<typeof assessProject>[0]): Promise<Assessment> {
  const result = await assessProject(options);
  if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
  return result.value;
}
