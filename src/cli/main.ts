/**
 * Setpoint Critic on the command line: headless evaluations for scripting, CI and batch runs.
 *   npm run cli -- evaluate <project.spcritic> [--json]
 */
import { parseArgs } from 'node:util';
import { runEvaluateCommand } from './evaluateCommand';

const USAGE = `Usage:
  npm run cli -- evaluate <project.spcritic> [--json]

Commands:
  evaluate   fit the action-value function of each candidate policy in the project to the
             project's logged data and report each policy value next to the logged behaviour's

Options:
  --json     write one JSON object to stdout instead of the readable table
  --help     show this text`;

export async function main(argv: string[]): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({ args: argv, allowPositionals: true, options: { json: { type: 'boolean' }, help: { type: 'boolean' } } });
  } catch (e) {
    process.stderr.write(`${(e as Error).message}\n\n${USAGE}\n`);
    return 2;
  }
  const [command, ...rest] = parsed.positionals;
  if (parsed.values.help || command === undefined) {
    (parsed.values.help ? process.stdout : process.stderr).write(`${USAGE}\n`);
    return parsed.values.help ? 0 : 2;
  }
  if (command !== 'evaluate') {
    process.stderr.write(`Unknown command "${command}".\n\n${USAGE}\n`);
    return 2;
  }
  if (rest.length !== 1) {
    process.stderr.write(`evaluate needs exactly one project file, got ${rest.length}.\n\n${USAGE}\n`);
    return 2;
  }
  return runEvaluateCommand(rest[0], { json: parsed.values.json === true });
}

main(process.argv.slice(2)).then(
  (code) => { process.exitCode = code; },
  (e: unknown) => {
    process.stderr.write(`Internal error: ${e instanceof Error ? e.message : String(e)}\nPlease report this with the project file.\n`);
    process.exitCode = 70;
  },
);
