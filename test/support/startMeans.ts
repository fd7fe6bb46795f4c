/**
 * J over given start states by seeded rollouts: the mean over starts of each start's mean return,
 * and its Monte Carlo standard error given the starts, √(Σ_i s_i²/R)/count with s_i² the sample
 * variance of start i's R returns (common practice for a mean of independent per-start means).
 * `rollout(start, k)` returns the discounted return of rollout k from start `start`, in the order
 * start 0 rollouts 0…R−1, start 1…, so a shared random stream gives the same numbers as before.
 */
export function meanOverStarts(count: number, rollouts: number, rollout: (start: number, k: number) => number): { value: number; standardError: number } {
  let total = 0, variance = 0;
  for (let i = 0; i < count; i++) {
    let sum = 0, squares = 0;
    for (let k = 0; k < rollouts; k++) {
      const g = rollout(i, k);
      sum += g;
      squares += g * g;
    }
    const mean = sum / rollouts;
    total += mean;
    variance += (squares - rollouts * mean * mean) / (rollouts - 1) / rollouts;
  }
  return { value: total / count, standardError: Math.sqrt(variance) / count };
}
