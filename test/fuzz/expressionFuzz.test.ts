/**
 * Fuzzing reward/cost expressions (fast-check, fixed seeds): grammar-shaped formulas of any depth
 * and width, and raw character soup, parsed and evaluated over a few columns. Each either parses
 * and evaluates to an array of the right length, or is refused with an ExpressionError whose
 * message is bounded — never another exception (a stack overflow was exit 70). A sample also goes
 * through the command line, which must answer 0–3.
 */
import { rm } from 'node:fs/promises';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateExpression } from '../../src/data/expressionEvaluation';
import { ExpressionError } from '../../src/data/expressionError';
import { parseExpression } from '../../src/data/expressionSyntax';
import { evaluateChecked, fuzzFolder, type FuzzFolder } from './fuzzHarness';

const COLUMNS: Record<string, Float64Array> = {
  level: Float64Array.from([1, 1.5, 2, 0, -1]),
  valve: Float64Array.from([40, 50, 60, 0, 100]),
  cost: Float64Array.from([0, 0.25, 1, 2.25, 6.25]),
};

const { expression } = fc.letrec<{ expression: string; leaf: string }>((tie) => ({
  leaf: fc.oneof(fc.constantFrom('level', 'valve', 'cost', '`level`', 'nope', '1', '0', '2.5e3', '1e400', '.5'), fc.double({ noNaN: true }).map(String)),
  expression: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    tie('leaf'),
    fc.tuple(tie('expression'), fc.constantFrom('+', '-', '*', '/', '^', '−'), tie('expression')).map(([a, op, b]) => `${a} ${op} ${b}`),
    tie('expression').map((e) => `(${e})`),
    tie('expression').map((e) => `-${e}`),
    fc.tuple(fc.constantFrom('abs', 'exp', 'log', 'sqrt', 'min', 'max', 'clamp', 'sin', 'constructor'), fc.array(tie('expression'), { minLength: 0, maxLength: 4 }))
      .map(([name, args]) => `${name}(${args.join(', ')})`),
  ),
}));

function check(source: string): void {
  try {
    const tree = parseExpression(source);
    const values = evaluateExpression(tree, (name) => {
      if (!(name in COLUMNS)) throw new ExpressionError(`no column named "${name}"`, source, 0);
      return COLUMNS[name];
    }, 5);
    expect(values).toHaveLength(5);
  } catch (e) {
    if (!(e instanceof ExpressionError)) throw e;
    expect(e.message.length).toBeLessThan(600);
  }
}

describe('expressions', () => {
  it('3,000 grammar-shaped expressions parse and evaluate, or are refused with an ExpressionError', () => {
    fc.assert(fc.property(expression, check), { seed: 2024, numRuns: 3000 });
  });

  it('2,000 character soups, deep nests and very long sums are refused cleanly', () => {
    const soup = fc.string({ unit: fc.constantFrom('(', ')', '-', '+', '^', '*', '/', ',', ' ', '`', 'a', 'abs', '1', 'e', '.', '\u0000', '\u202e'), maxLength: 3000 });
    const nest = fc.tuple(fc.integer({ min: 1, max: 5000 }), fc.constantFrom('(', 'abs(', '-', 'min(1,')).map(([n, open]) => `${open.repeat(n)}1${open === '-' ? '' : ')'.repeat(n)}`);
    const sum = fc.integer({ min: 1, max: 8000 }).map((n) => Array.from({ length: n }, () => 'level').join('+'));
    fc.assert(fc.property(fc.oneof(soup, nest, sum), check), { seed: 2025, numRuns: 2000 });
  });

  describe('through the command line', () => {
    let f: FuzzFolder;
    beforeAll(async () => {
      f = await fuzzFolder('spc-fuzz-expression-');
    });
    afterAll(() => rm(f.folder, { recursive: true, force: true }));

    it('300 expressions as the project\'s cost: exit 0–3', async () => {
      const project = JSON.parse(f.projectText);
      await fc.assert(
        fc.asyncProperty(expression, async (source) => {
          const doc = { ...project, columns: { ...project.columns, reward: { kind: 'expression', expression: source, sense: 'cost' } } };
          await evaluateChecked(f, JSON.stringify(doc));
        }),
        { seed: 2026, numRuns: 300 },
      );
    });
  });
});
