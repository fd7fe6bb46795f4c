/** The import's account in the readable output: how the file was read and every excluded row. */
import type { ImportedDataset } from '../data/importDataset';

/** Excluded rows listed in the table output; `--json` lists them all. */
const LISTED_EXCLUSIONS = 20;

export function formatImport(imported: ImportedDataset, dataPath: string): string {
  const s = imported.summary;
  const lines = [
    `Data: ${dataPath} — ${s.rowCount.toLocaleString('en-US')} rows, ${s.transitionCount.toLocaleString('en-US')} transitions, ${s.episodeCount} runs.`,
    ...imported.episodeReport.map((sentence) => `  ${sentence}`),
  ];
  if (imported.excluded.length > 0) {
    lines.push(`Excluded rows (${imported.excluded.length}):`);
    for (const row of imported.excluded.slice(0, LISTED_EXCLUSIONS)) {
      lines.push(`  line ${row.line}${row.column ? `, column ${row.column}` : ''}: ${row.reason}`);
    }
    const more = imported.excluded.length - LISTED_EXCLUSIONS;
    if (more > 0) lines.push(`  … and ${more} more (--json lists every one)`);
  }
  return `${lines.join('\n')}\n\n`;
}
