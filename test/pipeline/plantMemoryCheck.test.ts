/**
 * The plant-memory check's project-level numbers and words (src/pipeline/plantMemoryCheck.ts): named
 * states and signals, the sentence for the app and the report with the thresholds the rule applies
 * (src/core/diagnostics/plantMemoryFinding.ts), and a clear reason where the runs are too short.
 * Data: the battery's dead-time vessel (test/battery/deadTimePlant.ts; invented).
 */
import { describe, expect, it } from 'vitest';
import { PLANT_MEMORY_LAGS, PLANT_MEMORY_ROWS } from '../../src/core/limits';
import { plantMemoryAssessment } from '../../src/pipeline/plantMemoryCheck';
import { plantMemorySentence } from '../../src/pipeline/plantMemoryWords';
import { deadTimeLog } from '../battery/deadTimePlant';

describe('plant memory in the assessment', () => {
  it('names the state read and the earlier signal, and reads at most PLANT_MEMORY_ROWS rows at an even stride', () => {
    const { summary } = plantMemoryAssessment(deadTimeLog(2, 150, 3).logged); // 30,000 rows
    if ('reason' in summary) throw new Error(summary.reason);
    expect(summary.rowsBack).toBe(PLANT_MEMORY_LAGS);
    expect(summary.usableRows).toBe(150 * (200 - PLANT_MEMORY_LAGS));
    expect(summary.rowsUsed).toBeLessThanOrEqual(PLANT_MEMORY_ROWS);
    expect(summary.rowsUsed).toBeGreaterThan(PLANT_MEMORY_ROWS / 2);
    const jacket = summary.states.find((s) => s.state === 'jacket_temp_c')!;
    expect(jacket.strongest).toMatchObject({ signal: 'steam_valve_pct', kind: 'action', rowsBack: 2 });
    expect(jacket.adjustedPartialRSquared).toBeLessThanOrEqual(jacket.partialRSquared);
    expect(plantMemorySentence(summary)).toMatch(/^Plant memory: the 8 rows before explain at most [\d.]+\u00a0% .* in jacket_temp_c .*a caution above 5\u00a0%, serious above 50\u00a0%\)\.$/);
    expect(plantMemorySentence(summary)).toMatch(/\(1\d,\d{3} rows read;/); // with its thousands separator, as the app writes counts
  });

  it('gives its reason on runs shorter than the rows it reads back, and no warning', () => {
    const short = { ...deadTimeLog(1, 20, 3).logged };
    const episode = Int32Array.from(short.episode, (_, i) => Math.floor(i / 5)); // runs of 5 rows
    const result = plantMemoryAssessment({ ...short, episode });
    expect(result.summary).toMatchObject({ reason: expect.stringContaining('8 earlier rows of their own run') });
    expect(result.warnings).toEqual([]);
    expect(plantMemorySentence(result.summary)).toMatch(/^Plant memory: not checked — /);
    expect(plantMemorySentence(undefined)).toBeNull();
  });
});
