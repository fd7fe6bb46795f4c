/**
 * The command line in a child process that reports its peak resident memory (getrusage maxRSS) on
 * the last line of stderr, as `peak-rss-mib <n>`: the hostile-size tests run it to see that a huge
 * input ends in a clear error with bounded memory rather than a native abort.
 */
import { runCli } from '../../src/cli/run';

const code = await runCli(process.argv.slice(2));
process.stderr.write(`\npeak-rss-mib ${Math.round(process.resourceUsage().maxRSS / 1024)}\n`);
process.exitCode = code;
