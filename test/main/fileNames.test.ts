import { describe, expect, it } from 'vitest';
import { suggestedFileName, withExtension } from '../../src/main/fileNames';

// Microsoft, "Naming Files, Paths, and Namespaces" (reserved characters <>:"/\|?* and control
// characters) — the stricter of the platforms' rules, so names work everywhere.
describe('file names', () => {
  it('adds an extension a save dialog left off, in any letter case', () => {
    expect(withExtension('/p/tank', '.spcritic')).toBe('/p/tank.spcritic');
    expect(withExtension('/p/tank.SPCRITIC', '.spcritic')).toBe('/p/tank.SPCRITIC');
    expect(withExtension('/p/plot.png.svg', '.png')).toBe('/p/plot.png.svg.png');
  });

  it('suggests a portable name from a project name', () => {
    expect(suggestedFileName('Tank levels', '.spcritic')).toBe('Tank levels.spcritic');
    expect(suggestedFileName('Loop 3: valve/flow?', '.png')).toBe('Loop 3- valve-flow-.png');
    expect(suggestedFileName(' .. ', '.spcritic')).toBe('Untitled project.spcritic');
    expect(suggestedFileName('surface.csv', '.csv')).toBe('surface.csv');
  });
});
