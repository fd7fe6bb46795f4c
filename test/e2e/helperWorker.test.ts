/**
 * The app's second thread for the resample loop, in real Chromium: a test page (test/e2e/helper-page)
 * built with Vite and served with the app's own headers (rendererResponse: CSP, cross-origin
 * isolation) assesses the tank-levels sample (200 resamples) in a dedicated worker, as the app's
 * evaluation worker does, once with one thread and once with the nested helper worker
 * (src/renderer/src/worker/helperWorker.ts) lent from any amount of work. Checked: the bundled
 * helper starts, and the whole assessment is the same, compared as JSON, which keeps every double
 * exactly (the reference is the one-thread route: the same functions on the same multiplicities);
 * only `settings.threads` says which route ran. Below the helper's minimum work no thread starts.
 */
import { readFile } from 'node:fs/promises';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HELPER_THREAD_NOTE, ONE_THREAD_NOTE, ROLLOUT_THREAD_NOTE } from '../../src/pipeline/perDecisionRoute';
import { openHelperPage, type HelperPage } from './harness/helperPage';
import type { HelperRun } from './helper-page/main';

const here = dirname(fileURLToPath(import.meta.url));
const sample = resolve(here, '../../sample-projects/tank-levels');
/** Fewer than the default 1,000 to keep the test short: still 25 blocks of eight through the helper. */
const RESAMPLES = 200;
let helper: HelperPage;

async function assess(minimumWork: number | null): Promise<HelperRun & { assessment: Record<string, unknown> }> {
  const [text, csv] = await Promise.all([readFile(join(sample, 'tank-levels.spcritic'), 'utf8'), readFile(join(sample, 'tank-levels.csv'))]);
  const projectText = JSON.stringify({ ...(JSON.parse(text) as object), bootstrap: { resamples: RESAMPLES } });
  const run = await helper.page.evaluate(([text, bytes, work]) => window.helperPage.assess(text, new Uint8Array(bytes), work),
    [projectText, Array.from(csv), minimumWork] as const);
  return { ...run, assessment: run.ok ? (JSON.parse(run.json) as Record<string, unknown>) : {} };
}

/** The assessment without the words that name the route. */
function withoutThreads(assessment: Record<string, unknown>): unknown {
  const settings = assessment.settings as Record<string, unknown>;
  return { ...assessment, settings: { ...settings, threads: undefined } };
}

beforeAll(async () => {
  helper = await openHelperPage();
}, 240_000);

afterAll(async () => {
  await helper?.close();
});

describe('the app’s helper worker (e2e)', () => {
  it('gives the same assessment as one thread, and says it ran', async () => {
    const one = await assess(null), two = await assess(0);
    expect(one.ok, one.json.slice(0, 400)).toBe(true);
    expect(two.ok, two.json.slice(0, 400)).toBe(true);
    expect((one.assessment.settings as { threads: string }).threads).toBe(ONE_THREAD_NOTE);
    expect((two.assessment.settings as { threads: string }).threads).toBe(`${HELPER_THREAD_NOTE}; ${ROLLOUT_THREAD_NOTE}`); // the loop's helper and the rollouts' own
    expect(withoutThreads(two.assessment)).toEqual(withoutThreads(one.assessment));
    expect(helper.errors).toEqual([]);
  }, 240_000);

  it('starts no thread below its minimum work', async () => {
    const run = await assess(Number.POSITIVE_INFINITY);
    expect(run.ok).toBe(true);
    expect((run.assessment.settings as { threads: string }).threads).toMatch(/^one thread for the resamples \(too little work.*; the model rollouts on this thread \(too little work/);
  }, 240_000);
});
