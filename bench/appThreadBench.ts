/**
 * The app's second thread, measured where it runs: the peer plant's log (peerBench.ts) assessed in
 * headless Chromium in a dedicated worker, as the app's evaluation worker does (the test page of
 * test/e2e/helper-page), with one thread and with the nested helper worker
 * (src/renderer/src/worker/helperWorker.ts, lent as in the app), pair by pair, wall clock from
 * the page (open, fit and assessment with the default 1,000 resamples). Printed, never asserted.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { HELPER_MINIMUM_WORK } from '../src/pipeline/helperFeed';
import { openHelperPage } from '../test/e2e/harness/helperPage';
import { peerFiles, work } from './peerBench';

export async function runAppThreadBench(n: number, pairs = 2): Promise<Record<string, number | string>> {
  const { csv, project } = peerFiles(n);
  const helper = await openHelperPage({ [csv]: join(work, csv) });
  try {
    const projectText = await readFile(project, 'utf8');
    const one: number[] = [], two: number[] = [];
    let threads = '';
    for (let p = 0; p < pairs; p++) {
      for (const [minimumWork, times] of [[null, one], [HELPER_MINIMUM_WORK, two]] as const) {
        const run = await helper.page.evaluate(([text, path, work]) => window.helperPage.assessServed(text, path, work), [projectText, csv, minimumWork] as const);
        if (!run.ok) throw new Error(`app bench: ${run.json.slice(0, 400)}`);
        times.push(run.ms / 1000);
        if (minimumWork !== null) threads = (JSON.parse(run.json) as { settings: { threads: string } }).settings.threads;
      }
    }
    return {
      transitions: n, pairs, 'one thread (s)': one.map((t) => t.toFixed(1)).join(', '), 'with the helper worker (s)': two.map((t) => t.toFixed(1)).join(', '),
      'one thread / helper': one.map((t, i) => (t / two[i]).toFixed(2)).join(', '), 'resample threads': threads,
    };
  } finally {
    await helper.close();
  }
}
