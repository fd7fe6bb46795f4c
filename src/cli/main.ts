/**
 * Setpoint Critic on the command line: headless evaluations for scripting, CI and batch runs.
 *   npm run cli -- evaluate <project.spcritic> [--json] [--resamples N] [--level L]
 *   npm run cli -- report <project.spcritic> [--out report.html] [--resamples N] [--level L]
 */
import { parseArgs } from 'node:util';
import { runEvaluateCommand } from './evaluateCommand';
import { runReportCommand } from './reportCommand';

const USAGE = `Usage:
  npm run cli -- evaluate <project.spcritic> [--json] [--resamples N] [--level L]
  npm run cli -- report <project.spcritic> [--out report.html] [--resamples N] [--level L]

Commands:
  evaluate   fit the action-value function of each candidate policy in the project to the
             project's logged data and report each policy value next to the logged behaviour's,
             with bootstrap intervals, cross-checks and coverage diagnostics
  report     the same, written as one self-contained HTML report (job, data, settings,
             comparison, value surfaces, slices, diagnostics, cross-checks, sensitivity, cautions)

Options:
  --json            write one JSON object to stdout instead of the readable table (evaluate)
  --out <file>      where to write the report (default: <project>-report.html in this folder)
  --resamples <N>   bootstrap resamples of the episodes (default: the project's, else 1000)
  --level <L>       confidence level of the intervals (default: the project's, else 0.9)
  --help            show this text`;

export async function main(argv: string[]): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv, allowPositionals: true,
      options: { json: { type: 'boolean' }, help: { type: 'boolean' }, out: { type: 'string' }, resamples: { type: 'string' }, level: { type: 'string' } },
    });
  } catch (e) {
    process.stderr.write(`${(e as Error).message}\n\n${USAGE}\n`);
    return 2;
  }
  const [command, ...rest] = parsed.positionals;
  if (parsed.values.help || command === undefined) {
    (parsed.values.help ? process.stdout : process.stderr).write(`${USAGE}\n`);
    return parsed.values.help ? 0 : 2;
  }
  if (command !== 'evaluate' && command !== 'report') {
    process.stderr.write(`Unknown command "${command}".\n\n${USAGE}\n`);
    return 2;
  }
  if (rest.length !== 1) {
    process.stderr.write(`${command} needs exactly one project file, got ${rest.length}.\n\n${USAGE}\n`);
    return 2;
  }
  // Numbers are checked with the project's own settings (assessSettings.ts), which name the field.
  const number = (text: string | undefined) => (text === undefined ? undefined : Number(text));
  const overrides = { resamples: number(parsed.values.resamples), level: number(parsed.values.level) };
  if (command === 'report') return runReportCommand(rest[0], { ...overrides, out: parsed.values.out });
  return runEvaluateCommand(rest[0], { json: parsed.values.json === true, ...overrides });
}

main(process.argv.slice(2)).then(
  (code) => { process.exitCode = code; },
  (e: unknown) => {
    process.stderr.write(`Internal error: ${e instanceof Error ? e.message : String(e)}\nPlease report this with the project file.\n`);
    process.exitCode = 70;
  },
);
