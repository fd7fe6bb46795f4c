// Lint, chiefly to keep the layers of DEVELOPERS.md true: an import that points up a layer fails.
// core ← data, project, figures ← pipeline ← shared ← cli, renderer, main, preload; and inside the renderer
// format, state ← document ← worker ← session, plots, export ← components ← files, screens ← App.
// Built-in no-restricted-imports per folder (folder names as path segments).
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
  layer(['src/core/**'], ['data', 'project', 'pipeline', 'cli', 'host', 'main', 'preload', 'renderer', 'shared', 'figures'],
    [...nodeBuiltins, 'electron', 'react', 'react-dom', 'chart.js', 'zod', 'papaparse']),
  layer(['src/data/**'], ['pipeline', 'cli', 'host', 'main', 'preload', 'renderer', 'figures'], [...nodeBuiltins, 'electron', 'react']),
  layer(['src/project/**'], ['data', 'pipeline', 'cli', 'host', 'main', 'preload', 'renderer', 'figures'], [...nodeBuiltins, 'electron', 'react']),
  layer(['src/pipeline/**'], ['cli', 'host', 'main', 'preload', 'renderer'], [...nodeBuiltins, 'electron', 'react']),
  // host: Node-side file access shared by the two Node hosts (cli, main); it knows no app layer.
  layer(['src/host/**'], ['core', 'data', 'project', 'pipeline', 'cli', 'main', 'preload', 'renderer', 'shared', 'figures'], ['electron', 'react']),
  layer(['src/cli/**'], ['main', 'preload', 'renderer'], ['electron', 'react']),
  layer(['src/main/**'], ['renderer', 'cli', 'preload'], ['react']),
  layer(['src/figures/**'], ['data', 'project', 'pipeline', 'cli', 'host', 'main', 'preload', 'renderer', 'shared'],
    [...nodeBuiltins, 'electron', 'react', 'react-dom', 'zod', 'papaparse']),
  // figures: host-free chart specs and the SVG/PNG writers (app export and report); no DOM host either.
  {
    files: ['src/figures/**'],
    rules: { 'no-restricted-globals': ['error', ...['document', 'window', 'navigator', 'localStorage', 'HTMLCanvasElement'].map((name) => ({ name, message: 'layering: src/figures runs without a DOM (app, worker, command line)' }))] },
  },
  layer(['src/shared/**'], ['cli', 'host', 'main', 'preload', 'renderer'], [...nodeBuiltins, 'react', 'react-dom']),
  layer(['src/preload/**'], ['core', 'data', 'project', 'pipeline', 'cli', 'host', 'main', 'renderer', 'figures'], [...nodeBuiltins, 'react']),
  layer(['src/renderer/**'], ['main', 'cli', 'host', 'preload'], [...nodeBuiltins, 'electron']),
  // The renderer's inside: the worker runs the pipeline and knows nothing of the page.
  layer(['src/renderer/src/worker/**'], ['main', 'cli', 'host', 'preload', 'session', 'document', 'screens', 'components', 'plots', 'export', 'files', 'state', 'App'],
    [...nodeBuiltins, 'electron', 'react', 'react-dom', 'chart.js']),
  layer(['src/renderer/src/format/**', 'src/renderer/src/state/**'],
    ['main', 'cli', 'host', 'preload', 'session', 'document', 'worker', 'screens', 'components', 'plots', 'export', 'files', 'App'], [...nodeBuiltins, 'electron']),
  layer(['src/renderer/src/document/**'], ['main', 'cli', 'host', 'preload', 'session', 'worker', 'screens', 'components', 'plots', 'export', 'files', 'App'], [...nodeBuiltins, 'electron']),
  layer(['src/renderer/src/session/**'], ['main', 'cli', 'host', 'preload', 'screens', 'components', 'plots', 'export', 'files', 'App'], [...nodeBuiltins, 'electron']),
  layer(['src/renderer/src/plots/**', 'src/renderer/src/export/**'], ['main', 'cli', 'host', 'preload', 'session', 'document', 'worker', 'screens', 'components', 'files', 'App'],
    [...nodeBuiltins, 'electron']),
  layer(['src/renderer/src/components/**'], ['main', 'cli', 'host', 'preload', 'screens', 'files', 'App'], [...nodeBuiltins, 'electron']),
  layer(['src/renderer/src/files/**'], ['main', 'cli', 'host', 'preload', 'screens', 'components', 'App'], [...nodeBuiltins, 'electron']),
  layer(['src/renderer/src/screens/**'], ['main', 'cli', 'host', 'preload', 'App'], [...nodeBuiltins, 'electron']),
);
