// Results out of the workspace: every results table to CSV or XLSX, and the drawing to SVG,
// PNG or DXF. What every export is of (project, design, units) is provided here; the files are
// written by exportFiles.ts (tables) and drawingFiles.ts (the drawing), each loaded only when a
// download is asked for, so no page pays for papaparse, exceljs or dxf-writer before.
import { computed, inject, provide, type ComputedRef, type InjectionKey } from 'vue';
import type { ExportContext, ExportTable } from '@basinwright/common';
import { downloadBlob } from '@/download';

export type SheetFormat = 'csv' | 'xlsx';

const KEY: InjectionKey<ComputedRef<ExportContext>> = Symbol('export-context');

/** The workspace says what every export is of (project, design, units). */
export function provideExportContext(ctx: ComputedRef<ExportContext>): void {
  provide(KEY, ctx);
}

/** What an export is of; outside the workspace (a component alone in a test) a plain default. */
export function useExportContext(units: () => ExportContext['units']): ComputedRef<ExportContext> {
  const ctx = inject(KEY, null);
  return ctx ?? computed(() => ({ project: 'Project', design: 'Design', units: units() }));
}

/** Downloads a results table as CSV or XLSX. */
export async function downloadTable<Row>(
  table: ExportTable<Row>,
  ctx: ExportContext,
  format: SheetFormat,
): Promise<void> {
  const { tableFile } = await import('@/composables/exportFiles');
  const file = await tableFile(table, ctx, format);
  downloadBlob(file.name, file.blob);
}
