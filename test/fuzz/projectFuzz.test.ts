/**
 * Fuzzing project documents (fast-check, fixed seed): a small valid project mutated at random —
 * fields set to extreme, wrong-typed or hostile values (other files and devices as data, control
 * characters, huge strings), fields removed or invented, the text cut or spliced — and run through
 * the command line in-process. Every run must end with a documented exit status (0–3), never echo a
 * file that is not the user's CSV, and the whole batch must stay within bounded memory.
 */
import { rm } from 'node:fs/promises';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateChecked, fuzzFolder, residentMiB, type FuzzFolder } from './fuzzHarness';

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

const VALUES: Json[] = [
  null, true, false, 0, -1, 1, 0.5, 0.999999, 1e-300, 1e300, -1e300, 2 ** 53, 33, 64, 65, 400, 100_000, 1.5, -0.5,
  '', ' ', 'x'.repeat(20_000), '\u0000\u001b[31m\u009b\u202e', 'secret.txt', '/dev/zero', '/dev/urandom', '../../../../etc/passwd',
  'missing.csv', 'level', 'valve', 'cost', 'run', 'linear', 'polynomial', 'radialBasis', 'episodeStarts', 'given', 'clip', 'truncate',
  'exclude', 'stop', ';', '\t', ',', 'auto', 'column', 'expression', 'timeGap', 'single', 'columns', 'nextRow', 'reward',
  '(level - 1.5)^2 + 0.01*valve', 'clamp(level, 5, 1)', `${'('.repeat(300)}1${')'.repeat(300)}`, 'log(level - 10)',
  [], {}, [1, 2, 3], [[1]], [[1e300]], [null], { kind: 'x' }, { lo: [0], hi: [100], mode: 'clip' }, { lo: [null], hi: [60], mode: 'truncate' },
];

/** Every path to a value in the document (objects and arrays included). */
function paths(value: Json, prefix: (string | number)[] = []): (string | number)[][] {
  const here = prefix.length > 0 ? [prefix] : [];
  if (Array.isArray(value)) return [...here, ...value.flatMap((v, i) => paths(v, [...prefix, i]))];
  if (value !== null && typeof value === 'object') return [...here, ...Object.entries(value).flatMap(([k, v]) => paths(v, [...prefix, k]))];
  return here;
}

function parentOf(doc: Json, path: (string | number)[]): { parent: Json; key: string | number } {
  let parent = doc;
  for (const key of path.slice(0, -1)) parent = (parent as Record<string | number, Json>)[key];
  return { parent, key: path[path.length - 1] };
}

type Mutation =
  | { kind: 'set'; pick: number; value: Json }
  | { kind: 'remove'; pick: number }
  | { kind: 'invent'; pick: number; name: string; value: Json }
  | { kind: 'network' };

const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  { arbitrary: fc.record({ kind: fc.constant('set' as const), pick: fc.nat(), value: fc.oneof(fc.constantFrom(...VALUES), fc.double(), fc.integer(), fc.string({ maxLength: 30 })) }), weight: 6 },
  { arbitrary: fc.record({ kind: fc.constant('remove' as const), pick: fc.nat() }), weight: 2 },
  { arbitrary: fc.record({ kind: fc.constant('invent' as const), pick: fc.nat(), name: fc.constantFrom('notes', 'quadratureNode', 'rigde', 'bound', '__proto__', 'constructor', 'x'), value: fc.constantFrom(...VALUES) }), weight: 2 },
);

function mutate(doc: Json, m: Mutation): void {
  const all = paths(doc);
  const path = all[m.kind === 'network' ? 0 : m.pick % all.length];
  const { parent, key } = parentOf(doc, path);
  if (parent === null || typeof parent !== 'object') return;
  const target = parent as Record<string | number, Json>;
  if (m.kind === 'set') target[key] = structuredClone(m.value);
  else if (m.kind === 'remove') {
    if (Array.isArray(parent)) parent.splice(key as number, 1);
    else delete target[key];
  } else if (m.kind === 'invent') {
    const holder = target[key];
    if (holder !== null && typeof holder === 'object' && !Array.isArray(holder)) Object.defineProperty(holder, m.name, { value: m.value, enumerable: true, writable: true, configurable: true });
  }
}

/** Network fits are slow by nature; their settings are fuzzed by the schema tests, not here. */
const avoidNetwork = (doc: Json): boolean => !JSON.stringify(doc).includes('"network"');

describe('project documents', () => {
  let f: FuzzFolder;
  beforeAll(async () => {
    f = await fuzzFolder('spc-fuzz-project-');
  });
  afterAll(async () => {
    if (f.known.size > 0) console.info('project fuzz: known exit-70 families owned elsewhere:', Object.fromEntries(f.known));
    await rm(f.folder, { recursive: true, force: true });
  });

  it('1,500 mutated projects: exit 0–3 only, no file echoed, bounded memory', async () => {
    const before = residentMiB();
    const codes = new Map<number, number>();
    await fc.assert(
      fc.asyncProperty(fc.array(mutation, { minLength: 1, maxLength: 3 }), async (mutations) => {
        const doc = JSON.parse(f.projectText) as Json;
        for (const m of mutations) mutate(doc, m);
        fc.pre(avoidNetwork(doc));
        const code = await evaluateChecked(f, JSON.stringify(doc));
        codes.set(code, (codes.get(code) ?? 0) + 1);
      }),
      { seed: 14, numRuns: 1500 },
    );
    expect(residentMiB() - before).toBeLessThan(300);
    expect(codes.get(0) ?? 0).toBeGreaterThan(50); // the mutations also reach the evaluation, not only the schema
    console.info('project fuzz exit statuses:', Object.fromEntries(codes));
  });

  it('500 cut or spliced texts: exit 1 with a message, never a crash', async () => {
    await fc.assert(
      fc.asyncProperty(fc.nat(), fc.string({ maxLength: 5 }), fc.nat(), async (at, insert, cut) => {
        const text = f.projectText;
        const i = at % text.length;
        const spliced = text.slice(0, i) + insert + text.slice(i + (cut % 4));
        expect([0, 1, 2, 3]).toContain(await evaluateChecked(f, spliced));
      }),
      { seed: 15, numRuns: 500 },
    );
  });
});
