import type { Page } from 'playwright-core';

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

/**
 * The same window measured from Chromium's own trace (devtools.timeline): each main-thread task's
 * wall time and its thread CPU time. On a busy machine a task's wall time includes the time the
 * thread waited for a core; its CPU time is what the page itself spent.
 */
export interface TaskTrace {
  stop(): Promise<{ longestWallMs: number; longestCpuMs: number; tasksOver50CpuMs: number; tasks: number }>;
}

interface TraceEvent { name: string; ph: string; pid: number; tid: number; dur?: number; tdur?: number; args?: { name?: string } }

export async function startTaskTrace(page: Page): Promise<TaskTrace> {
  const cdp = await page.context().newCDPSession(page);
  const events: TraceEvent[] = [];
  const traced = cdp as unknown as { on(event: string, f: (e: { value: TraceEvent[] }) => void): void; once(event: string, f: () => void): void };
  traced.on('Tracing.dataCollected', (e) => { events.push(...e.value); });
  await cdp.send('Tracing.start', { categories: 'toplevel,devtools.timeline,disabled-by-default-devtools.timeline', transferMode: 'ReportEvents' });
  return {
    async stop() {
      const done = new Promise<void>((resolve) => traced.once('Tracing.tracingComplete', resolve));
      await cdp.send('Tracing.end');
      await done;
      await cdp.detach();
      const main = events.find((e) => e.ph === 'M' && e.name === 'thread_name' && e.args?.name === 'CrRendererMain');
      const tasks = events.filter((e) => main && e.pid === main.pid && e.tid === main.tid && e.ph === 'X' && (e.name === 'RunTask' || e.name === 'ThreadControllerImpl::RunTask'));
      const ms = (us: number | undefined) => (us ?? 0) / 1000;
      return {
        longestWallMs: Math.max(0, ...tasks.map((t) => ms(t.dur))),
        longestCpuMs: Math.max(0, ...tasks.map((t) => ms(t.tdur))),
        tasksOver50CpuMs: tasks.filter((t) => ms(t.tdur) > 50).length,
        tasks: tasks.length,
      };
    },
  };
}
