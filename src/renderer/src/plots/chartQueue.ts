/**
 * Charts are made one per task: Chart.js draws a chart synchronously when it is made, and a
 * screen that mounts several at once (Findings after a run) would otherwise draw them all in one
 * main-thread task of hundreds of milliseconds. Each job runs in its own macrotask, so input and
 * painting get in between (W3C Long Tasks: a task over 50 ms is a long task).
 */
const queue: (() => void)[] = [];
let draining = false;

function drain(): void {
  const job = queue.shift();
  job?.();
  if (queue.length > 0) setTimeout(drain, 0);
  else draining = false;
}

/** Run job in a task of its own, after those queued before it; the returned function cancels it. */
export function scheduleChart(job: () => void): () => void {
  let cancelled = false;
  queue.push(() => {
    if (!cancelled) job();
  });
  if (!draining) {
    draining = true;
    setTimeout(drain, 0);
  }
  return () => {
    cancelled = true;
  };
}
