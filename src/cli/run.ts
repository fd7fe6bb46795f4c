/**
 * The command line's whole behaviour as one function, so tests (and the fuzz suite) run it
 * in-process with their own terminal. Exit statuses, as the README documents them:
 *   0 success; 1 a problem with the project or its data; 2 wrong usage; 3 a fit did not converge;
 *   130 cancelled with Ctrl+C; 141 the output's reader went away (… | head); 70 an internal error (a bug) — never for any input the program can name.
 *   setpoint-critic evaluate <project.spcritic> [--json] [--resamples N] [--level L]
 *   setpoint-critic report <project.spcritic> [--out report.html] [--resamples N] [--level L]
 *   setpoint-critic --help | --version
 * (`setpoint-critic` is the built out/cli/main.js, vite.cli.config.ts; `npm run cli --` runs the sources.)
 */
import { parseArgs } from 'node:util';
import { runEvaluateCommand } from './evaluateCommand';
import { runReportCommand } from './reportCommand';
import { EXIT } from './exitStatus';
import { processTerminal, type Terminal } from './terminal';
// The version is the package's (a build inlines this one field).
import { version } from '../../package.json';
import { BOOTSTRAP_RESAMPLES, CONFIDENCE_LEVEL } from '../core/limits';


const USAGE = `Usage:
  setpoint-critic evaluate <project.spcritic> [--json] [--resamples N] [--level L]
  setpoint-critic report <project.spcritic> [--out report.html] [--resamples N] [--level L]
  (in a source checkout: npm run build:cli, then node out/cli/main.js …; or npm run cli -- …)

Commands:
  evaluate   fit the action-value function of each candidate policy in the project to the
             project’s logged data and report each policy value next to the present controller’s,
             with bootstrap intervals, cross-checks and coverage diagnostics
  report     the same, written as one self-contained HTML report (job, data, settings,
             comparison, value surfaces, slices, diagnostics, cross-checks, sensitivity, cautions)

Options:
  --json            write one JSON object to stdout instead of the readable table (evaluate)
  --out <file>      where to write the report (default: <project>-report.html in this folder);
                    never the project file or its data file
  --resamples <N>   bootstrap resamples of the runs (default: the project’s, else ${BOOTSTRAP_RESAMPLES.default})
  --level <L>       confidence level of the intervals (default: the project’s, else ${CONFIDENCE_LEVEL.default})
  --help            show this text
  --version         show the version

Exit status: 0 success; 1 a problem with the project or its data; 2 wrong usage;
3 a fit did not converge; 130 cancelled (Ctrl+C); 141 the output was closed (e.g. | head);
70 an internal error (please report it).`;

export async function runCli(argv: string[], terminal: Terminal = processTerminal): Promise<number> {
  try {
    return await dispatch(argv, terminal);
  } catch (e) {
    terminal.err(`Internal error: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}\nPlease report this with the project file.\n`);
    return EXIT.internal;
  }
}

async function dispatch(argv: string[], terminal: Terminal): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv, allowPositionals: true,
      options: { json: { type: 'boolean' }, help: { type: 'boolean' }, version: { type: 'boolean' }, out: { type: 'string' }, resamples: { type: 'string' }, level: { type: 'string' } },
    });
  } catch (e) {
    terminal.err(`${(e as Error).message}\n\n${USAGE}\n`);
    return EXIT.usage;
  }
  if (parsed.values.version) {
    terminal.out(`setpoint-critic ${version}\n`);
    return EXIT.ok;
  }
  const [command, ...rest] = parsed.positionals;
  if (parsed.values.help || command === undefined) {
    (parsed.values.help ? terminal.out : terminal.err)(`${USAGE}\n`);
    return parsed.values.help ? EXIT.ok : EXIT.usage;
  }
  if (command !== 'evaluate' && command !== 'report') {
    terminal.err(`Unknown command "${command}".\n\n${USAGE}\n`);
    return EXIT.usage;
  }
  if (rest.length !== 1) {
    terminal.err(`${command} needs exactly one project file, got ${rest.length}.\n\n${USAGE}\n`);
    return EXIT.usage;
  }
  // Numbers are checked with the project's own settings (assessSettings.ts), which name the field.
  const number = (text: string | undefined) => (text === undefined ? undefined : Number(text));
  const overrides = { resamples: number(parsed.values.resamples), level: number(parsed.values.level) };
  if (command === 'report') return runReportCommand(rest[0], { ...overrides, out: parsed.values.out, terminal });
  return runEvaluateCommand(rest[0], { json: parsed.values.json === true, ...overrides, terminal });
}
