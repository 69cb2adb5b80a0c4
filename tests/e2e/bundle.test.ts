// The built app's first load (issue 13, item 3), read from Vite's manifest of the build that
// `npm test` makes before this project runs: the sign-in page's scripts carry neither the unit
// library (mathjs) nor the charts (echarts); the design workspace's own scripts carry mathjs but
// no chart, which comes with the chart components only. Sizes are measured in `npm run bench`.
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
