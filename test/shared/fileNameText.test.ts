/**
 * File names made from names the user wrote: every suggested export name must pass the export
 * channel's own check (src/shared/ipcChannels.ts: no / or \), whatever the candidate or project is
 * called. The forbidden set is Windows' (Microsoft, "Naming Files, Paths, and Namespaces").
 */
import { describe, expect, it } from 'vitest';
import { fileNameText } from '../../src/shared/fileNameText';
import { API_ARGUMENTS } from '../../src/shared/ipcChannels';

describe('fileNameText', () => {
  it('replaces the characters file systems refuse: a candidate "PI (25 %/K, 30 min)" in an export name', () => {
    expect(fileNameText('value-surface-PI (25 %/K, 30 min).png')).toBe('value-surface-PI (25 %-K, 30 min).png');
    expect(fileNameText('a<b>c:d"e\\f|g?h*i\u0001j')).toBe('a-b-c-d-e-f-g-h-i-j');
    expect(fileNameText('  .hidden name.  ')).toBe('hidden name');
  });

  it('gives names the export channel accepts (its own argument check, not a copy of it)', () => {
    const schema = API_ARGUMENTS.exportFile.schema;
    for (const name of ['value-surface-PI (25 %/K, 30 min)', 'action-slice-Trimmed (level 150, temperature 3 %/unit)', 'Plant 2\\3-report']) {
      expect(schema.safeParse(['png', fileNameText(`${name}.png`), new Uint8Array(8)]).success, name).toBe(true);
      expect(schema.safeParse(['png', `${name}.png`, new Uint8Array(8)]).success, `${name} unchanged`).toBe(false);
    }
  });
});
