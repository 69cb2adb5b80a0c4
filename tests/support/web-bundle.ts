// The built web app's chunks as Vite's manifest (web/dist/.vite/manifest.json) lists them: which
// files a view loads before it can run (its chunk and every static import, transitively). Read
// by tests/e2e/bundle.test.ts and by `npm run bench` (scripts/bench-first-load.ts).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';

export interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  isDynamicEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
}
export type Manifest = Record<string, ManifestChunk>;

export const WEB_DIST = fileURLToPath(new URL('../../web/dist/', import.meta.url));

export function readManifest(dist = WEB_DIST): Manifest {
  return JSON.parse(readFileSync(join(dist, '.vite', 'manifest.json'), 'utf8')) as Manifest;
}

/** The key of index.html's script. */
export function entryKey(m: Manifest): string {
  const key = Object.keys(m).find((k) => m[k]!.isEntry === true && k.endsWith('index.html'));
  if (!key) throw new Error('the manifest has no index.html entry');
  return key;
}

/** Files (assets/…js) of these manifest keys and all their static imports. */
export function staticFiles(m: Manifest, keys: readonly string[]): string[] {
  const seen = new Set<string>();
  const todo = [...keys];
  while (todo.length > 0) {
    const key = todo.pop()!;
    if (seen.has(key)) continue;
    const chunk = m[key];
    if (!chunk) throw new Error(`the manifest has no ${key}`);
    seen.add(key);
    todo.push(...(chunk.imports ?? []));
  }
  return [...seen].map((k) => m[k]!.file);
}

/** Gzipped size in bytes at the strongest level (as the build's .gz files). */
export function gzipBytes(content: Buffer | string): number {
  return gzipSync(content, { level: 9 }).length;
}

/**
 * Text that only the library's own code carries, kept by minification: mathjs's table of units
 * names the hogshead; an echarts chart instance has the method getZr; exceljs writes a
 * workbook's sheets under xl/worksheets; dxf-writer names AcDbEntity in every entity; papaparse
 * reports an UndetectableDelimiter. The engine (what useStudy's fallback runs in the page when
 * the worker cannot be used): the USBR Type I module's source, which only the catalogue of
 * designs carries (a page names a type from basins/names.ts, never the catalogue).
 * ant-design-vue's form item flags itself __ANT_NEW_FORM_ITEM, its Input module names
 * AInputPassword and its Button module AButtonGroup; vee-validate's form provides itself under
 * the symbol vee-validate-form-context.
 */
export const LIBRARY_MARKS = {
  mathjs: 'hogshead',
  echarts: 'getZr',
  exceljs: 'xl/worksheets',
  dxfWriter: 'AcDbEntity',
  papaparse: 'UndetectableDelimiter',
  engine: 'jump length curve via Chow 1959',
  antdForm: '__ANT_NEW_FORM_ITEM',
  antdInput: 'AInputPassword',
  antdButton: 'AButtonGroup',
  veeValidate: 'vee-validate-form-context',
} as const;
