// Lint, chiefly to keep the layers of DEVELOPERS.md true: an import that points up a layer fails.
// core ← data, project, figures ← pipeline ← cli, renderer, main. Built-in no-restricted-imports per folder.
import tseslint from 'typescript-eslint';

const nodeBuiltins = ['node:*', 'fs', 'path', 'os', 'child_process', 'crypto', 'worker_threads'];
const layer = (files, forbiddenFolders, forbiddenModules = []) => ({
  files,
  rules: {
    'no-restricted-imports': ['error', {
      patterns: [
        ...forbiddenFolders.map((folder) => ({
          group: [`**/${folder}`, `**/${folder}/**`],
          message: `layering: this folder may not import from src/${folder} (see DEVELOPERS.md, "Layers")`,
        })),
        ...(forbiddenModules.length ? [{ group: forbiddenModules, message: 'layering: not available in this layer' }] : []),
      ],
    }],
  },
});

export default tseslint.config(
  { ignores: ['out/**', 'node_modules/**', 'test-artifacts/**'] },
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  layer(['src/core/**'], ['data', 'project', 'pipeline', 'cli', 'main', 'preload', 'renderer', 'shared', 'figures'],
    [...nodeBuiltins, 'electron', 'react', 'react-dom', 'chart.js', 'zod', 'papaparse']),
  // figures: host-free chart specs and the SVG/PNG writers (app export and report); core only, no DOM host.
  layer(['src/figures/**'], ['data', 'project', 'pipeline', 'cli', 'main', 'preload', 'renderer', 'shared'],
    [...nodeBuiltins, 'electron', 'react', 'react-dom', 'zod', 'papaparse']),
  {
    files: ['src/figures/**'],
    rules: { 'no-restricted-globals': ['error', ...['document', 'window', 'navigator', 'localStorage', 'HTMLCanvasElement'].map((name) => ({ name, message: 'layering: src/figures runs without a DOM (app, worker, command line)' }))] },
  },
  layer(['src/data/**'], ['pipeline', 'cli', 'main', 'preload', 'renderer', 'figures'], [...nodeBuiltins, 'electron', 'react']),
  layer(['src/project/**'], ['data', 'pipeline', 'cli', 'main', 'preload', 'renderer', 'figures'], [...nodeBuiltins, 'electron', 'react']),
  layer(['src/pipeline/**'], ['cli', 'main', 'preload', 'renderer'], [...nodeBuiltins, 'electron', 'react']),
  layer(['src/cli/**'], ['main', 'preload', 'renderer'], ['electron', 'react']),
  layer(['src/main/**'], ['renderer', 'cli', 'preload'], ['react']),
  layer(['src/renderer/**'], ['main', 'cli'], [...nodeBuiltins, 'electron']),
);
