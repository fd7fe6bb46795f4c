/**
 * The standard error of a cross-check's difference from fitted Q-evaluation when the fit has no
 * resamples to pair the check's with (a network: its interval comes from its own last-layer
 * resampling, not from the assessment's resamples).
 *
 * For two estimates A and B of the same J on the same logs,
 *   Var(A − B) = σ_A² + σ_B² − 2ρ·σ_A·σ_B,   −1 ≤ ρ ≤ 1
 * (variance of a difference; e.g. Casella & Berger, "Statistical Inference", 2nd ed., Thm 4.5.6 —
 * from memory), so |σ_A − σ_B| ≤ sd(A − B) ≤ σ_A + σ_B whatever ρ is (Minkowski's inequality).
 * Paired resamples estimate ρ; without them it is unknown, and taking the check's own σ alone, as
 * if the fit had no spread, can fall below the lower end (it does whenever σ_fit > 2·σ_check: a
 * network whose interval is wide beside a model check's narrow one). The upper end, σ_A + σ_B,
 * holds for any correlation, so "disagrees" and "agrees" (crossCheckVerdict.ts) are then claimed
 * only where they would hold for every ρ; a choice that widens the verdict's band of
 * "uninformative", never narrows it.
 */

/** σ_check + σ_fit; a missing or non-finite part makes it infinite (nothing can be claimed). */
export function unpairedStandardError(checkStandardError: number | null, fitStandardError: number): number {
  if (checkStandardError === null || !Number.isFinite(checkStandardError) || !Number.isFinite(fitStandardError)) return Infinity;
  return checkStandardError + fitStandardError;
}
