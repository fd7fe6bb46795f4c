/**
 * Setpoint Critic on the command line: headless evaluations for scripting, CI and batch runs.
 * The behaviour and the exit statuses are run.ts's; this file only connects it to the process.
 *   npm run cli -- evaluate <project.spcritic> [--json] [--resamples N] [--level L]
 *   npm run cli -- report <project.spcritic> [--out report.html] [--resamples N] [--level L]
 */
import { stopWhenOutputCloses } from './closedOutput';
import { runCli } from './run';

stopWhenOutputCloses(process.stdout);
runCli(process.argv.slice(2)).then((code) => {
  process.exitCode = code;
});
