/** The runs split into blocks by the rule in runBlocks.ts's doc comment (hand-counted cases). */
import { describe, expect, it } from 'vitest';
import { runBlocks } from '../../../src/core/drift/runBlocks';

describe('runBlocks', () => {
  it('splits 250 runs into five blocks of 50 at mean positions 24.5 … 224.5, read at run 249', () => {
    const b = runBlocks(250);
    if ('reason' in b) throw new Error(b.reason);
    expect([...b.first]).toEqual([0, 50, 100, 150, 200]);
    expect([...b.size]).toEqual([50, 50, 50, 50, 50]);
    expect([...b.position]).toEqual([24.5, 74.5, 124.5, 174.5, 224.5]);
    expect(b.lastRun).toBe(249);
  });

  it('gives the extra runs to the earlier blocks, and fewer blocks to a short log', () => {
    const b = runBlocks(103);
    if ('reason' in b) throw new Error(b.reason);
    expect([...b.size]).toEqual([21, 21, 21, 20, 20]);
    const short = runBlocks(79); // ⌊79/20⌋ = 3 blocks: 27, 26, 26
    if ('reason' in short) throw new Error(short.reason);
    expect([...short.size]).toEqual([27, 26, 26]);
    expect(short.position[2]).toBe(53 + 12.5);
  });

  it('gives a reason instead of fewer than three blocks', () => {
    expect(runBlocks(59)).toEqual({ reason: '59 runs make 2 blocks of at least 20 runs; a trend needs 3' });
  });
});
