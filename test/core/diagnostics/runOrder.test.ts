/**
 * The run-order check (src/core/diagnostics/runOrder.ts, runOrderFinding.ts) against outside facts:
 * Spearman's ρ of small tables against a hand computation and a published worked example, its null
 * distribution against the normal tail, and the finding on logs built to have, or not have, a change.
 */
import { describe, expect, it } from 'vitest';
import { averageRanks, runOrderTrends, spearmanRho, spearmanTrend, type RunOrderData } from '../../../src/core/diagnostics/runOrder';
import { fewestRunsToShow, runOrderFinding, runOrderSeverity } from '../../../src/core/diagnostics/runOrderFinding';
import { createRandom } from '../../../src/core/random';

describe('Spearman’s rank correlation', () => {
  it('matches a hand computation without ties: ρ = 1 − 6Σd²/(n(n² − 1))', () => {
    // d = (−1, 1, −1, 1, 0), Σd² = 4, ρ = 1 − 24/120 = 0.8 (by hand).
    expect(spearmanRho([1, 2, 3, 4, 5], [2, 1, 4, 3, 5])).toBeCloseTo(0.8, 12);
  });

  it('gives tied values their average rank, and ρ is Pearson’s r of the ranks', () => {
    // y ranks (1.5, 1.5, 3, 4); by hand: Sxy = 4.5, Sxx = 5, Syy = 4.5, ρ = 4.5/√22.5 = 0.948683...
    expect(Array.from(averageRanks([1, 1, 2, 3]))).toEqual([1.5, 1.5, 3, 4]);
    expect(spearmanRho([1, 2, 3, 4], [1, 1, 2, 3])).toBeCloseTo(4.5 / Math.sqrt(22.5), 12);
    // A table with a tie in x: scipy.stats.spearmanr (a general-purpose reference library) gives −0.7207499701564473.
    expect(spearmanRho([3.1, 1.2, 5.5, 2.2, 4.0, 4.0, 0.5], [10, 30, 20, 25, 5, 15, 40])).toBeCloseTo(-0.7207499701564473, 12);
  });

  it('matches the published worked example of IQ against hours of television (ρ = −29/165)', () => {
    // The worked example in Wikipedia's article "Spearman's rank correlation coefficient" (from memory;
    // scipy.stats.spearmanr gives the same −0.17575757...).
    const iq = [106, 100, 86, 101, 99, 103, 97, 113, 112, 110], tv = [7, 27, 2, 50, 28, 29, 20, 12, 6, 17];
    expect(spearmanRho(iq, tv)).toBeCloseTo(-29 / 165, 12);
  });

  it('under independence, z = ρ√(n − 1) exceeds the normal two-sided points as often as the normal tail says, within Monte Carlo error', () => {
    // Kendall & Gibbons, Rank Correlation Methods (from memory): under independence Var ρ = 1/(n − 1) exactly and ρ√(n − 1) → N(0, 1).
    const random = createRandom(37), draws = 4000, n = 60, position = Array.from({ length: n }, (_, i) => i);
    const levels = [0.1, 0.05, 0.01], hits = levels.map(() => 0);
    for (let d = 0; d < draws; d++) {
      const series = Array.from({ length: n }, () => random.normal());
      const { p } = spearmanTrend(spearmanRho(position, series), n);
      levels.forEach((a, k) => { if (p <= a) hits[k]++; });
    }
    levels.forEach((a, k) => {
      const share = hits[k] / draws, se = Math.sqrt((a * (1 - a)) / draws);
      expect(Math.abs(share - a)).toBeLessThan(4 * se);
    });
  });
});

/**
 * A first-order plant x' = a·x + b·u + load + w under u = offset − k·x + dither, runs of `steps` rows; `change(r)`
 * sets (k, b) of run r, and optionally the law's offset and an unlogged load.
 */
function loggedRuns(runs: number, steps: number, seed: number, change: (r: number) => { k: number; b: number; offset?: number; load?: number }, dither = 0.1): RunOrderData {
  const random = createRandom(seed), n = runs * steps;
  const states = new Float64Array(n), actions = new Float64Array(n), nextStates = new Float64Array(n), episode = new Int32Array(n);
  for (let r = 0, i = 0; r < runs; r++) {
    const { k, b, offset = 0, load = 0 } = change(r);
    let x = random.normal();
    for (let t = 0; t < steps; t++, i++) {
      const u = offset - k * x + dither * random.normal(), next = 0.8 * x + b * u + load + 0.1 * random.normal();
      states[i] = x; actions[i] = u; nextStates[i] = next; episode[i] = r;
      x = next;
    }
  }
  return { count: n, stateDim: 1, actionDim: 1, states, actions, nextStates, episode };
}

const names = { stateNames: ['level'], actionNames: ['valve'] };

describe('the run-order check', () => {
  it('finds nothing on a stationary log', () => {
    for (const seed of [1, 2, 3]) {
      const result = runOrderTrends(loggedRuns(200, 100, seed, () => ({ k: 0.4, b: 0.5 })), 10);
      expect(runOrderSeverity(result)).toBeNull();
      expect(runOrderFinding(result, names)).toBeNull();
    }
  });

  it('calls a controller retuned halfway through the log serious, naming the gain and what to do', () => {
    const result = runOrderTrends(loggedRuns(200, 100, 4, (r) => ({ k: r < 100 ? 0.2 : 0.5, b: 0.5 })), 10);
    const finding = runOrderFinding(result, names);
    expect(finding?.severity).toBe('serious');
    expect(finding?.message).toContain('the present controller’s gain of valve on level');
    expect(finding?.message).toContain('the order they appear in the data');
    expect(finding?.message).toContain('exclude the earlier rows');
    expect(finding?.message).toContain('No candidate is named for a trial');
  });

  it('calls a plant whose response to the action drifts serious', () => {
    const result = runOrderTrends(loggedRuns(200, 100, 5, (r) => ({ k: 0.4, b: 0.5 - 0.1 * (r / 200) })), 10);
    const finding = runOrderFinding(result, names);
    expect(finding?.severity).toBe('serious');
    expect(finding?.message).toContain('the plant’s response of next level to valve');
  });

  // offset38 (/work/notes/offset38-rule.md): the law's output level alone — serious when it stepped (a setpoint
  // moved: u = −k(x − x_sp) has offset k·x_sp), a caution when it drifts (an integral taking up a load that grows
  // steadily: offset −load/b, the load also in the plant, so the plant model's offset drifts with it).
  it('calls the law’s output level that moved in one step serious (a setpoint moved), and one that drifts with a growing load a caution', () => {
    const stepped = runOrderTrends(loggedRuns(200, 100, 7, (r) => ({ k: 0.4, b: 0.5, offset: 0.4 * (r < 100 ? 0 : 0.5) })), 10);
    const moved = runOrderFinding(stepped, names);
    expect(moved?.severity).toBe('serious');
    expect(moved?.message).toContain('output level moved in one step');
    expect(moved?.message).toContain('No candidate is named for a trial');
    const drifting = runOrderTrends(loggedRuns(200, 100, 8, (r) => { const load = 0.2 * (r / 200); return { k: 0.4, b: 0.5, offset: -load / 0.5, load }; }), 10);
    const taken = runOrderFinding(drifting, names);
    expect(taken?.severity).toBe('caution');
    expect(taken?.message).toContain('Only an offset moved');
  });

  it('skips and counts runs without dither for the plant model, and says why it cannot read too few runs', () => {
    const result = runOrderTrends(loggedRuns(30, 50, 6, () => ({ k: 0.4, b: 0.5 }), 0), 10);
    expect('reason' in result ? null : result.modelSkipped).toBe(30);
    expect('reason' in result ? null : result.lawSkipped).toBe(0);
    const short = runOrderTrends(loggedRuns(5, 50, 6, () => ({ k: 0.4, b: 0.5 })), 10);
    expect('reason' in short && short.reason).toContain('at least 10 runs');
  });
});

describe('the fewest runs that can show a change (review finding: a small log must not read "no coefficient changed")', () => {
  // Reference: the smallest n with K·2·Φ(−√(n − 1)) ≤ 10⁻³, computed with scipy.stats.norm.sf for K = 5, 11, 16, 38, 81
  // (the coefficients of logs with 1–6 states and 1–3 actions) by the review of this check.
  it('matches the normal tail computed outside the project', () => {
    expect([5, 11, 16, 38, 81].map((k) => fewestRunsToShow(k, 1e-3))).toEqual([15, 17, 18, 19, 21]);
  });
});

describe('a stationary plant and controller whose operating point moves with the season (review of this check)', () => {
  // Invented: x' = x + 0.2·(d − x) + 0.5·u + 0.1·ε, one law u = clip(0.9 − 0.6·x + 0.1·η, 0, 1) throughout,
  // the disturbance level d falling from 0 to −1.5 over the runs, so the law sits at its upper limit more and
  // more often. Least squares on the clipped values attenuates the gain by the share at the limit (Tobin,
  // Econometrica 1958); the baseline's censored fit does not, so neither may the check.
  function seasonal(limits: boolean): RunOrderData {
    const rng = createRandom(11), runs = 150, steps = 200, n = runs * steps;
    const states = new Float64Array(n), actions = new Float64Array(n), nextStates = new Float64Array(n), episode = new Int32Array(n);
    let i = 0;
    for (let r = 0; r < runs; r++) {
      const d = -1.5 * r / (runs - 1);
      let x = d;
      for (let t = 0; t < steps; t++, i++) {
        const u = Math.min(1, Math.max(0, 0.9 - 0.6 * x + 0.1 * rng.normal()));
        const next = x + 0.2 * (d - x) + 0.5 * u + 0.1 * rng.normal();
        states[i] = x; actions[i] = u; nextStates[i] = next; episode[i] = r;
        x = next;
      }
    }
    return { count: n, stateDim: 1, actionDim: 1, states, actions, nextStates, episode, ...(limits ? { actionLimits: { lo: [0], hi: [1] } } : {}) };
  }
  it('least squares on the clipped actions would call the law retuned; the censored per-run fit does not', () => {
    expect(runOrderSeverity(runOrderTrends(seasonal(false), 10))).toBe('serious');
    expect(runOrderSeverity(runOrderTrends(seasonal(true), 10))).not.toBe('serious');
  });
});
