/**
 * When the reader of the command's output goes away (`setpoint-critic evaluate … --json | head -1`),
 * Node reports the write as an EPIPE 'error' event on stdout, which unhandled ends the process with a
 * stack trace. The command then stops at once, writing nothing more, with status 141 = 128 + 13, the
 * status of a program that SIGPIPE ended (common practice; README, "Exit status"). Other write errors
 * are left to Node.
 */
import { EXIT } from './exitStatus';

/** Stop quietly with EXIT.outputClosed once `stream`'s reader has gone. */
export function stopWhenOutputCloses(stream: NodeJS.WriteStream, exit: (code: number) => void = (code) => process.exit(code)): void {
  stream.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code !== 'EPIPE') throw error;
    exit(EXIT.outputClosed);
  });
}
