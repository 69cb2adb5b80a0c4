// The built app's first load (issue 13, item 3), read from Vite's manifest of the build that
// `npm test` makes before this project runs: the sign-in page's scripts carry neither the unit
// library (mathjs) nor the charts (echarts), nor a form library (its form is plain markup: no
// ant-design-vue Form, Input or Button, no vee-validate); the design workspace's own scripts
// carry mathjs but no chart, which comes with the chart components only. Sizes are measured in
// `npm run bench` (firstLoad.signIn.jsGzipKB).
import { readFileSync } from 'node:fs';
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

  it('the workspace loads mathjs (the units) but no chart until a chart is shown', () => {
    const workspace = staticFiles(manifest, [
      entry,
      'src/components/AppShell.vue',
      'src/views/DesignWorkspaceView.vue',
      'src/components/DesignSizingStep.vue',
    ]);
    expect(carrying(workspace, LIBRARY_MARKS.mathjs)).not.toEqual([]);
    expect(carrying(workspace, LIBRARY_MARKS.echarts)).toEqual([]);
    const chart = staticFiles(manifest, ['src/components/DesignToeChart.vue']);
    expect(carrying(chart, LIBRARY_MARKS.echarts)).not.toEqual([]);
  });
});
