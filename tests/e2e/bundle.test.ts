// The built app's first load (issue 13, item 3), read from Vite's manifest of the build that
// `npm test` makes before this project runs: the sign-in page's scripts carry neither the unit
// library (mathjs) nor the charts (echarts), nor a form library (its form is plain markup: no
// ant-design-vue Form, Input or Button, no vee-validate); the design workspace's own scripts
// carry no chart, no mathjs (the conversions by kind need none), no engine (the study runs in
// its worker; the page's fallback imports it when needed) and no export library (loaded on a
// download). Each is still in the build, where it is needed. Sizes are measured in
// `npm run bench` (firstLoad.signIn.jsGzipKB, firstLoad.workspace.jsGzipKB).
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  LIBRARY_MARKS,
  WEB_DIST,
  entryKey,
  readManifest,
  staticFiles,
} from '../support/web-bundle';

const manifest = readManifest();
const entry = entryKey(manifest);
const carrying = (files: string[], mark: string): string[] =>
  files.filter((f) => readFileSync(join(WEB_DIST, f), 'utf8').includes(mark));
/** Every script of the build (the page's chunks and the worker's). */
const allScripts = readdirSync(join(WEB_DIST, 'assets'))
  .filter((f) => f.endsWith('.js'))
  .map((f) => `assets/${f}`);

describe('what each page loads (the build manifest)', () => {
  it('the sign-in page loads neither mathjs nor echarts', () => {
    const files = staticFiles(manifest, [entry, 'src/views/SignInView.vue']);
    expect(files.length).toBeGreaterThan(1);
    expect(carrying(files, LIBRARY_MARKS.mathjs)).toEqual([]);
    expect(carrying(files, LIBRARY_MARKS.echarts)).toEqual([]);
  });

  it('the sign-in page loads no form library: no antd Form, Input or Button, no vee-validate', () => {
    const marks = [
      LIBRARY_MARKS.antdForm,
      LIBRARY_MARKS.antdInput,
      LIBRARY_MARKS.antdButton,
      LIBRARY_MARKS.veeValidate,
    ];
    const signIn = staticFiles(manifest, [entry, 'src/views/SignInView.vue']);
    for (const mark of marks) expect(carrying(signIn, mark), mark).toEqual([]);
    // The marks still find each library where it is used (the sign-up page's antd form with
    // vee-validate), so the check above cannot pass by a mark that no longer matches anything.
    const signUp = staticFiles(manifest, [entry, 'src/views/SignUpView.vue']);
    for (const mark of marks) expect(carrying(signUp, mark), mark).not.toEqual([]);
  });

  it('the signed-in frame is its own chunk, not one the sign-in page loads', () => {
    const signIn = staticFiles(manifest, [entry, 'src/views/SignInView.vue']);
    expect(signIn).not.toContain(manifest['src/components/AppShell.vue']!.file);
  });

  const workspace = staticFiles(manifest, [
    entry,
    'src/components/AppShell.vue',
    'src/views/DesignWorkspaceView.vue',
    'src/components/DesignSizingStep.vue',
  ]);

  it('the workspace at the Sizing step loads no chart until a chart is shown', () => {
    expect(carrying(workspace, LIBRARY_MARKS.echarts)).toEqual([]);
    const chart = staticFiles(manifest, ['src/components/DesignToeChart.vue']);
    expect(carrying(chart, LIBRARY_MARKS.echarts)).not.toEqual([]);
  });

  it('the workspace does not carry the engine: the fallback of the study imports it when needed', () => {
    expect(carrying(workspace, LIBRARY_MARKS.engine)).toEqual([]);
    const fallback = staticFiles(manifest, ['src/composables/studyInThread.ts']);
    expect(carrying(fallback, LIBRARY_MARKS.engine)).not.toEqual([]);
    expect(manifest['src/composables/studyInThread.ts']!.isDynamicEntry).toBe(true);
  });

  it('the workspace loads no mathjs: only the steps converting arbitrary units (take-off, estimate) do', () => {
    expect(carrying(workspace, LIBRARY_MARKS.mathjs)).toEqual([]);
    const takeoff = staticFiles(manifest, ['src/components/DesignTakeoffStep.vue']);
    expect(carrying(takeoff, LIBRARY_MARKS.mathjs)).not.toEqual([]);
  });

  it.each(['exceljs', 'dxfWriter', 'papaparse'] as const)(
    'the workspace loads no %s: it comes with a download (or a rating file)',
    (library) => {
      const mark = LIBRARY_MARKS[library];
      expect(carrying(allScripts, mark)).not.toEqual([]);
      expect(carrying(workspace, mark)).toEqual([]);
    },
  );
});
