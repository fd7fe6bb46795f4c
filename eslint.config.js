// Lint, chiefly to keep the layers of DEVELOPERS.md true: an import that points up a layer fails.
// core ← data, project ← pipeline ← cli, renderer, main. Built-in no-restricted-imports per folder.
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
  layer(['src/core/**'], ['data', 'project', 'pipeline', 'cli', 'main', 'preload', 'renderer', 'shared', 'host'],
    [...nodeBuiltins, 'electron', 'react', 'react-dom', 'chart.js', 'zod', 'papaparse']),
  layer(['src/data/**'], ['pipeline', 'cli', 'main', 'preload', 'renderer', 'host'], [...nodeBuiltins, 'electron', 'react']),
  layer(['src/project/**'], ['data', 'pipeline', 'cli', 'main', 'preload', 'renderer', 'host'], [...nodeBuiltins, 'electron', 'react']),
  layer(['src/pipeline/**'], ['cli', 'main', 'preload', 'renderer', 'host'], [...nodeBuiltins, 'electron', 'react']),
  // host: Node-side file access shared by the two Node hosts (cli, main); it knows no app layer.
  layer(['src/host/**'], ['core', 'data', 'project', 'pipeline', 'cli', 'main', 'preload', 'renderer', 'shared'], ['electron', 'react']),
  layer(['src/cli/**'], ['main', 'preload', 'renderer'], ['electron', 'react']),
  layer(['src/main/**'], ['renderer', 'cli', 'preload'], ['react']),
  layer(['src/renderer/**'], ['main', 'cli', 'host'], [...nodeBuiltins, 'electron']),
);
