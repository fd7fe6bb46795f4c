/**
 * Options for `expect.poll` in the e2e tests: every read of the page after a key press or click
 * that changes state is retried until it matches (React commits and worker replies are
 * asynchronous), so a test never reads a field once and races the update.
 */
export const POLL = { timeout: 15_000, interval: 50 } as const;
