import { describe, expect, it } from 'vitest';
import { CAUTION_SHORT } from '../../src/pipeline/cautions';
import { wrap } from '../../src/figures/writers/captionLayout';
import { exportCaption as captionWith, withCaution as cautionWith, type CaptionParts } from '../../src/figures/writers/exportCaption';

const exportCaption = (parts: CaptionParts) => captionWith(parts, CAUTION_SHORT);
const withCaution = (caption: string) => cautionWith(caption, CAUTION_SHORT);

describe('exportCaption', () => {
  const caption = exportCaption({ project: 'Tank levels', policy: 'gentle gain', settings: 'γ = 0.95, degree 2, 5 nodes, seed 7', date: '2025-01-15' });

  it('has the project, policy, settings and date, then the caution', () => {
    const [facts, caution] = caption.split('\n');
    expect(facts).toBe('Project: Tank levels · Policy: gentle gain · γ = 0.95, degree 2, 5 nodes, seed 7 · 2025-01-15');
    expect(caution).toBe(CAUTION_SHORT);
  });

  it('keeps each part on its line even when a part holds line breaks', () => {
    expect(exportCaption({ project: 'A\nB', policy: ' p ', settings: '', date: 'd' }).split('\n')).toEqual(['Project: A B · Policy: p · d', CAUTION_SHORT]);
  });

  it('withCaution adds the caution once to any caption', () => {
    expect(withCaution('mine')).toBe(`mine\n${CAUTION_SHORT}`);
    expect(withCaution(caption)).toBe(caption);
    expect(withCaution('')).toBe(CAUTION_SHORT);
  });
});

describe('caption wrapping', () => {
  const width = (t: string) => t.length; // one unit per character
  it('wraps greedily at word boundaries', () => {
    expect(wrap('aa bb cc dd', 5, width)).toEqual(['aa bb', 'cc dd']);
    expect(wrap('aa bb cc', 100, width)).toEqual(['aa bb cc']);
  });
  it('keeps a word longer than the line whole', () => {
    expect(wrap('a verylongword b', 4, width)).toEqual(['a', 'verylongword', 'b']);
  });
});
