/**
 * The main thread's responsiveness in the page, measured with the Long Tasks API (W3C Long Tasks
 * API Level 1: a task over 50 ms is a long task) and the longest gap between animation frames.
 * Pass the functions to page.evaluate: start before the actions to watch, stop after.
 */
export function startMainThreadProbe(): void {
  const probe = { longestTaskMs: 0, longTasks: 0, longestFrameGapMs: 0, running: true, observer: null as PerformanceObserver | null };
  probe.observer = new PerformanceObserver((list) => {
    for (const entry of list.getEntries()) {
      probe.longTasks++;
      probe.longestTaskMs = Math.max(probe.longestTaskMs, entry.duration);
    }
  });
  probe.observer.observe({ type: 'longtask' });
  let last = performance.now();
  const frame = (now: number) => {
    probe.longestFrameGapMs = Math.max(probe.longestFrameGapMs, now - last);
    last = now;
    if (probe.running) requestAnimationFrame(frame);
  };
  requestAnimationFrame(frame);
  (window as unknown as { __probe: typeof probe }).__probe = probe;
}

export function stopMainThreadProbe(): { longestTaskMs: number; longTasks: number; longestFrameGapMs: number } {
  const probe = (window as unknown as { __probe: { longestTaskMs: number; longTasks: number; longestFrameGapMs: number; running: boolean; observer: PerformanceObserver } }).__probe;
  probe.running = false;
  probe.observer.disconnect();
  return { longestTaskMs: probe.longestTaskMs, longTasks: probe.longTasks, longestFrameGapMs: probe.longestFrameGapMs };
}
