/**
 * The rule's summary (/work/notes/pdis36-rule.md; test/battery/README.md, "First-order standard
 * errors of the per-decision checks") from the rows bench/perDecisionFirstOrderRows.ts printed:
 *
 *   npx tsx bench/perDecisionFirstOrderTable.ts rows-a.tsv rows-b.tsv
 *
 * (a) verdicts unchanged on ≥ 95 % of rows, headlines on ≥ 95 % of models, no model turned to confirmed
 * while its range misses the truth; (b) the ratio first-order SE / resampled SE: median in [0.9, 1.1], no
 * row below 0.7. Printed for all rows, then the candidates' and the present controller's apart.
 */
import { readFileSync } from 'node:fs';

const RULE = { unchanged: 0.95, median: [0.9, 1.1], floor: 0.7 } as const;

interface Row { plant: string; seed: string; model: string; check: string; ratio: number; before: string; after: string; headBefore: string; headAfter: string; turned: string }

/** Every row once: a log run twice (the same seed gives the same numbers) counts once. */
function rowsOf(files: string[]): Row[] {
  const seen = new Set<string>();
  return files.flatMap((f) => readFileSync(f, 'utf8').split('\n').filter((l) => l && !l.startsWith('plant') && l.split('\t').length >= 12).map((l) => {
    const x = l.split('\t');
    return { plant: x[0], seed: x[1], model: x[2], check: x[3], ratio: Number(x[6]), before: x[7], after: x[8], headBefore: x[9], headAfter: x[10], turned: x[11] };
  })).filter((r) => {
    const key = `${r.plant}|${r.seed}|${r.model}|${r.check}`;
    return !seen.has(key) && seen.add(key);
  });
}

function median(x: number[]): number {
  const s = [...x].sort((a, b) => a - b), m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

function summary(label: string, rows: Row[]): void {
  if (!rows.length) return;
  const models = new Map(rows.map((r) => [`${r.plant}|${r.seed}|${r.model}`, r]));
  const verdicts = rows.filter((r) => r.before === r.after).length, heads = [...models.values()].filter((r) => r.headBefore === r.headAfter).length;
  const ratios = rows.map((r) => r.ratio), below = ratios.filter((r) => r < RULE.floor).length;
  const missed = [...models.values()].filter((r) => r.turned.startsWith('MISSES')).length;
  const plants = new Set(rows.map((r) => r.plant)).size, logs = new Set(rows.map((r) => `${r.plant}|${r.seed}`)).size;
  const held = (ok: boolean) => (ok ? 'holds' : 'FAILS');
  console.log(`${label}: ${rows.length} rows, ${models.size} models, ${logs} logs of ${plants} plants`);
  console.log(`  (a) verdict unchanged ${verdicts}/${rows.length} (${(100 * verdicts / rows.length).toFixed(1)} %), headline unchanged ${heads}/${models.size}, turned confirmed while missing the truth ${missed}: ${held(verdicts / rows.length >= RULE.unchanged && heads / models.size >= RULE.unchanged && missed === 0)}`);
  console.log(`  (b) SE ratio median ${median(ratios).toFixed(3)}, min ${Math.min(...ratios).toFixed(3)}, max ${Math.max(...ratios).toFixed(3)}, rows below ${RULE.floor}: ${below}: ${held(median(ratios) >= RULE.median[0] && median(ratios) <= RULE.median[1] && below === 0)}`);
}

function perPlant(rows: Row[]): void {
  console.log(['plant', 'rows', 'median ratio', 'min ratio', 'rows < 0.7', 'verdicts changed', 'headlines changed', 'verdicts (resampled)'].join('\t'));
  for (const plant of [...new Set(rows.map((r) => r.plant))]) {
    const mine = rows.filter((r) => r.plant === plant), ratios = mine.map((r) => r.ratio);
    const models = new Map(mine.map((r) => [`${r.seed}|${r.model}`, r]));
    const kinds = [...new Set(mine.map((r) => r.before))].map((k) => `${k} ${mine.filter((r) => r.before === k).length}`).join(', ');
    console.log([plant, mine.length, median(ratios).toFixed(2), Math.min(...ratios).toFixed(2), ratios.filter((r) => r < RULE.floor).length,
      mine.filter((r) => r.before !== r.after).length, [...models.values()].filter((r) => r.headBefore !== r.headAfter).length, kinds].join('\t'));
  }
}

const rows = rowsOf(process.argv.slice(2));
summary('all rows', rows);
summary('candidates', rows.filter((r) => r.model !== 'present controller'));
summary('present controller', rows.filter((r) => r.model === 'present controller'));
summary('candidates, informative by the resampled route', rows.filter((r) => r.model !== 'present controller' && r.before !== 'uninformative'));
perPlant(rows);
