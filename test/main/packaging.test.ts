/**
 * The packaging configuration (electron-builder.json, used by `npm run package`) sets the Electron
 * fuses the security defaults call for (GUIDE §5; the fuse names and meanings are Electron's,
 * "Electron Fuses" in its documentation): no ELECTRON_RUN_AS_NODE, no NODE_OPTIONS, no --inspect,
 * ASAR integrity checked, the app loaded only from its ASAR, cookies encrypted. The app must then
 * not need what those fuses take away: no child_process.fork in the main process (it relies on
 * ELECTRON_RUN_AS_NODE), and no file:// pages (the app serves itself over its own scheme).
 */
import { readFileSync, readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = resolve(__dirname, '../..');
const config = JSON.parse(readFileSync(join(root, 'electron-builder.json'), 'utf8'));
const packageJson = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8'));

describe('packaging configuration', () => {
  it('flips the fuses: run-as-Node, NODE_OPTIONS and --inspect off; ASAR integrity, ASAR only and cookie encryption on', () => {
    expect(config.electronFuses).toMatchObject({
      runAsNode: false,
      enableNodeOptionsEnvironmentVariable: false,
      enableNodeCliInspectArguments: false,
      enableEmbeddedAsarIntegrityValidation: true,
      onlyLoadAppFromAsar: true,
      enableCookieEncryption: true,
      grantFileProtocolExtraPrivileges: false,
    });
  });

  it('packs the built app into an ASAR whose integrity is embedded, from what electron-vite builds', () => {
    expect(config.asar).toBe(true);
    expect(config.asarUnpack).toBeUndefined();
    expect(config.files).toContain('out/**');
    expect(packageJson.main).toMatch(/^\.\/out\//);
    expect(packageJson.scripts.package).toContain('--config electron-builder.json');
  });

  it('needs nothing the fuses take away: no fork in the main process, no file:// pages', () => {
    const code = (f: string) => readFileSync(join(root, 'src/main', f), 'utf8').replace(/\/\*[\s\S]*?\*\/|^\s*\/\/.*$/gm, ''); // comments may say "file://"
    const main = readdirSync(join(root, 'src/main')).map(code).join('\n');
    expect(main).not.toMatch(/\bfork\(|ELECTRON_RUN_AS_NODE|loadFile\(|file:\/\//);
  });

  it('downloads nothing at install: electron-builder is run at packaging time, not installed', () => {
    const all = { ...packageJson.dependencies, ...packageJson.devDependencies };
    expect(all['electron-builder']).toBeUndefined();
  });
});
