/**
 * The network approximator on logs that changed (a retune, a moved setpoint, a drift), read from the rows
 * bench/holdoutCliRows.ts wrote with --out and the command line's own answers beside them (`*.cli.json`):
 *
 *   npx tsx bench/netChangeRows.ts /work/notes/netchange40-rows/*.json
 *
 * One line per log (plant, cut, seed): the runs kept, the run-order finding (its severity, step or drift,
 * and under a cut the whole log's reading), the present controller's J error against the truth of the
 * plant's logging law and whether its interval holds that truth (within 2 truth standard errors, as the
 * rows bench says), its confirmation, each candidate's error and class, every fit's stopping status, what
 * the function-class verdict said of the network against the linear estimate, and the trial. Then the
 * counts the rule (/work/notes/netchange40-rule.md) reads.
 */
import { existsSync, readFileSync } from 'node:fs';

type Warning = { severity: string; topic: string; candidate?: string };
interface CandidateRow { plant: string; seed: number; candidate: string; err: number; kind: string; status: string }
interface BaselineRow {
  plant: string; seed: number; err: number; holds: boolean; keptRuns: { from: number; runs: number; why: string } | null;
  confirmation: { status: string }; globalWarnings: Warning[]; trial: { named: string | null; verdict: string };
  runOrder: { change?: { kind: string; runLabel?: string }; wholeLog?: { reading?: string } } | null;
}
interface FitEstimate { status: string }
interface ClassVerdict { settled?: boolean | null; reason?: string }
interface Cli {
  policies: (FitEstimate & { name: string })[];
  presentController: { estimate?: FitEstimate } | null;
  assessment: { candidates: { name: string; functionClasses?: ClassVerdict }[]; presentController?: { functionClasses?: ClassVerdict } };
}

/** The network-against-linear sentence (core/fqe/approximatorAgreement.ts) in one word, or the verdict where it is not the reason. */
function agreement(v: ClassVerdict | undefined): string {
  const reason = v?.reason ?? '';
  if (/linear[^.]*estimate disagree/.test(reason)) return 'disagree';
  if (/too little data to tell/.test(reason)) return 'too wide to tell';
  if (/linear[^.]*estimate agree/.test(reason)) return 'agree';
  if (v?.settled === true) return 'settled';
  return v?.settled === false ? 'not settled (polynomial pair)' : 'one class';
}

/** How many fits stopped how: "converged ×4" or "converged ×3, maxIterations ×1". */
function statuses(cli: Cli): string {
  const all = [...cli.policies.map((p) => p.status), cli.presentController?.estimate?.status ?? 'none'];
  const counts = new Map<string, number>();
  for (const s of all) counts.set(s, (counts.get(s) ?? 0) + 1);
  return [...counts].map(([s, n]) => `${s} ×${n}`).join(', ');
}

const signed = (x: number) => `${x >= 0 ? '+' : ''}${x.toFixed(1)}`;
const short = (plant: string) => plant.replace(/^holdout-/, '');

function runOrderWords(b: BaselineRow): string {
  const w = b.globalWarnings.find((x) => x.topic === 'runOrder');
  const change = b.runOrder?.change, where = change ? `, ${change.kind}${change.kind === 'step' ? ` at "${change.runLabel}"` : ''}` : '';
  const whole = b.runOrder?.wholeLog?.reading ? ` (whole log: ${b.runOrder.wholeLog.reading})` : '';
  return `${w ? w.severity : 'none'}${w ? where : ''}${whole}`;
}

function main(): void {
  const files = process.argv.slice(2).filter((f) => f.endsWith('.json') && !f.endsWith('.cli.json') && !f.endsWith('.baseline.json'));
  if (files.length === 0) throw new Error('usage: npx tsx bench/netChangeRows.ts rows.json …  (the --out files of bench/holdoutCliRows.ts)');
  console.log('| plant | cut | seed | kept | run-order finding | present controller err % | its interval | confirmation | candidates: err % (class) | fits stopped | network vs linear: present / candidates | trial |');
  console.log('|---|---|---|---|---|---|---|---|---|---|---|---|');
  const tally = new Map<string, { confidentWrong: number; rows: number; wrongTrials: number; holds: number; logs: number }>();
  for (const file of files) {
    const base = file.replace(/\.json$/, ''), baselineFile = `${base}.baseline.json`;
    if (!existsSync(baselineFile)) { console.log(`| ${file} | (no baseline rows: the run did not finish) |`); continue; }
    const rows = JSON.parse(readFileSync(file, 'utf8')) as CandidateRow[];
    for (const b of JSON.parse(readFileSync(baselineFile, 'utf8')) as BaselineRow[]) {
      const cli = JSON.parse(readFileSync(`${base}-${b.plant}-s${b.seed}.cli.json`, 'utf8')) as Cli;
      const mine = rows.filter((r) => r.plant === b.plant && r.seed === b.seed);
      const cut = b.keptRuns ? 'as advised' : 'whole log';
      const kept = b.keptRuns ? `${b.keptRuns.from}–${b.keptRuns.runs - 1} (${b.keptRuns.why})` : 'all';
      const candidates = mine.map((r) => `${r.candidate} ${signed(r.err)} (${r.kind})`).join('; ');
      const verdicts = cli.assessment.candidates.map((c) => agreement(c.functionClasses)).join(', ');
      console.log(`| ${short(b.plant)} | ${cut} | ${b.seed} | ${kept} | ${runOrderWords(b)} | ${signed(b.err)} | ${b.holds ? 'holds' : 'misses'} | ${b.confirmation.status} | ${candidates} | ${statuses(cli)} | ${agreement(cli.assessment.presentController?.functionClasses)} / ${verdicts} | ${b.trial.named ?? 'none'} → ${b.trial.verdict} |`);
      const key = `${short(b.plant)} | ${cut}`, t = tally.get(key) ?? { confidentWrong: 0, rows: 0, wrongTrials: 0, holds: 0, logs: 0 };
      t.confidentWrong += mine.filter((r) => r.kind === 'confident & wrong').length;
      t.rows += mine.length;
      t.wrongTrials += /WRONG/.test(b.trial.verdict) ? 1 : 0;
      t.holds += b.holds ? 1 : 0;
      t.logs += 1;
      tally.set(key, t);
    }
  }
  console.log('\n| plant | cut | logs | candidate rows confident & wrong | wrong trials | present controller\'s interval holds |');
  console.log('|---|---|---|---|---|---|');
  for (const [key, t] of [...tally].sort(([a], [b]) => a.localeCompare(b))) console.log(`| ${key} | ${t.logs} | ${t.confidentWrong} of ${t.rows} | ${t.wrongTrials} | ${t.holds} of ${t.logs} |`);
}
main();
