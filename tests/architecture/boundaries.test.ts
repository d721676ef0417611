// The architecture rules of .dependency-cruiser.cjs, enforced by dependency-cruiser (a maintained tool, not our own
// import parser): lib/ never imports components/ or app/; lib/signal imports nothing from the app and only
// allow-listed packages; no import cycles, type-only imports included; a 'use client' file never reaches a module
// that imports the server-only package. The second test proves each rule bites on a small tree that breaks it.
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const root = process.cwd();
const CONFIG = join(root, '.dependency-cruiser.cjs');
const DEPCRUISE = join(root, 'node_modules', 'dependency-cruiser', 'bin', 'dependency-cruise.mjs');

function depcruise(cwd: string, paths: string[]) {
  const run = spawnSync(process.execPath, [DEPCRUISE, ...paths, '--config', CONFIG, '--output-type', 'err'], { cwd, encoding: 'utf8' });
  return { code: run.status, output: `${run.stdout}${run.stderr}` };
}

describe('architecture (dependency-cruiser)', () => {
  it('app/, components/ and lib/ keep every rule', () => {
    const { code, output } = depcruise(root, ['app', 'components', 'lib']);
    expect(output, output).toMatch(/no dependency violations found/);
    expect(code, output).toBe(0);
  });

  const fixture = mkdtempSync(join(tmpdir(), 'stanceline-arch-'));
  afterAll(() => rmSync(fixture, { recursive: true, force: true }));

  it('fails on each kind of forbidden import (a tree that breaks every rule once)', () => {
    const files: Record<string, string> = {
      'tsconfig.json': JSON.stringify({ compilerOptions: { module: 'esnext', moduleResolution: 'bundler', jsx: 'react-jsx', paths: { '@/*': ['./*'] } } }),
      'node_modules/server-only/package.json': JSON.stringify({ name: 'server-only', version: '0.0.1', main: 'index.js' }),
      'node_modules/server-only/index.js': '',
      'node_modules/left-pad/package.json': JSON.stringify({ name: 'left-pad', version: '1.3.0', main: 'index.js' }),
      'node_modules/left-pad/index.js': '',
      // lib -> components
      'lib/db/rows.ts': "import 'server-only';\nimport { Badge } from '@/components/ui/badge';\nexport const rows = [Badge];\n",
      'components/ui/badge.tsx': 'export const Badge = 1;\n',
      // lib/signal -> the app, and -> a package that is not allow-listed
      'lib/signal/filter.ts': "import { rows } from '@/lib/db/rows';\nimport pad from 'left-pad';\nexport const f = [rows, pad];\n",
      // a cycle made of type-only imports
      'components/charts/a.ts': "import type { B } from './b';\nexport type A = { b?: B };\n",
      'components/charts/b.ts': "import type { A } from './a';\nexport type B = { a?: A };\n",
      // a client component reaching a server-only module through a plain module
      'components/home/panel.tsx': "'use client';\nimport { load } from './load';\nexport const Panel = load;\n",
      'components/home/load.ts': "import { rows } from '@/lib/db/rows';\nexport const load = rows;\n",
    };
    for (const [path, text] of Object.entries(files)) {
      mkdirSync(dirname(join(fixture, path)), { recursive: true });
      writeFileSync(join(fixture, path), text);
    }
    const { code, output } = depcruise(fixture, ['app', 'components', 'lib'].filter((d) => d !== 'app'));
    expect(code, output).not.toBe(0);
    for (const rule of ['lib-not-to-app-or-components', 'signal-is-self-contained', 'signal-only-allowed-packages', 'no-circular', 'client-not-to-server-only']) {
      expect(output, `rule ${rule} did not fire:\n${output}`).toContain(`error ${rule}:`);
    }
    expect(output).toMatch(/lib\/db\/rows\.ts → components\/ui\/badge\.tsx/);
    expect(output).toMatch(/components\/home\/panel\.tsx → [\s\S]*node_modules\/server-only/);
  });
});
