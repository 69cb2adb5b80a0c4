import { download, request } from './client';

export interface PriceBook {
  id: string;
  name: string;
  currency: string;
  notes: string;
  archived: boolean;
  archivedAt: string | null;
  itemCount: number;
  createdAt: string;
  updatedAt: string;
}

export interface PriceItem {
  code: string;
  description: string;
  unit: string;
  unitPrice: number;
  currency?: string;
  source?: string;
  dateNote?: string;
}

export type PriceBookWithItems = PriceBook & {
  items: PriceItem[];
  /** take-off line key → item code, remembered by the book */
  takeoffMapping?: Record<string, string>;
};
export type ImportMapping = Partial<Record<keyof PriceItem, string>>;

export interface ImportPreview {
  format: 'csv' | 'xlsx';
  headers: string[];
  rows: { line: number; cells: string[] }[];
  rowCount: number;
  mapping: ImportMapping;
  errors: { line: number; field: string; message: string }[];
  errorCount: number;
  validCount: number;
}

const book = (id: string) => `/price-books/${encodeURIComponent(id)}`;

function upload(file: File, fields: Record<string, string>): FormData {
  const form = new FormData();
  for (const [key, value] of Object.entries(fields)) form.append(key, value);
  form.append('file', file);
  return form;
}

export const priceBooksApi = {
  list: (signal?: AbortSignal) => request<{ items: PriceBook[] }>('/price-books', { signal }),
  get: (id: string, signal?: AbortSignal) => request<PriceBookWithItems>(book(id), { signal }),
  create: (body: { name: string; currency?: string; notes?: string }) =>
    request<PriceBookWithItems>('/price-books', { method: 'POST', body }),
  update: (
    id: string,
    body: { name?: string; currency?: string; notes?: string; archived?: boolean },
  ) => request<PriceBookWithItems>(book(id), { method: 'PATCH', body }),
  saveItems: (id: string, items: PriceItem[]) =>
    request<PriceBookWithItems>(`${book(id)}/items`, { method: 'PUT', body: { items } }),
  copy: (id: string) => request<PriceBookWithItems>(`${book(id)}/copy`, { method: 'POST' }),
  preview: (file: File, mapping?: ImportMapping) =>
    request<ImportPreview>('/price-books/import/preview', {
      method: 'POST',
      body: upload(file, mapping === undefined ? {} : { mapping: JSON.stringify(mapping) }),
    }),
  import: (id: string, file: File, mapping: ImportMapping, mode: 'merge' | 'replace') =>
    request<{ added: number; updated: number }>(`${book(id)}/import`, {
      method: 'POST',
      body: upload(file, { mapping: JSON.stringify(mapping), mode }),
    }),
  export: (id: string, format: 'csv' | 'xlsx') =>
    download(`${book(id)}/export`, { format }, `price-book.${format}`),
};

export interface TakeoffLineView {
  key: string;
  kind: string;
  element: string;
  quantityKind: 'earthwork' | 'mass' | 'area' | 'length';
  quantity: number;
  unit: string;
  basis: string;
}

export interface TakeoffAssumptionView {
  key: string;
  value: number;
  defaultValue: number;
  overridden: boolean;
  unitKind: 'length' | 'ratio' | 'slope' | 'density' | 'reinforcement';
  unit: string;
  source: string;
  confidence: string;
  illustrative: boolean;
  label: string;
}

export interface TakeoffView {
  projectId: string;
  units: 'SI' | 'US';
  problem: string | null;
  stale: boolean;
  type: string | null;
  lines: TakeoffLineView[];
  totals: Record<string, number> | null;
  assumptions: TakeoffAssumptionView[];
  soil: string | null;
  notes: string[];
  overrides: Record<string, number | string>;
}

export interface EstimateSettings {
  locationFactor: number;
  percentages: {
    mobilisation: number;
    careOfWater: number;
    contingency: number;
    overheadAndProfit: number;
  };
  escalation: { annualRate: number; years: number };
  accuracy: { aaceClass: 3 | 4 | 5; low?: number; high?: number };
}

export interface EstimateLine {
  key: string;
  code: string;
  description: string;
  unit: string;
  unitPrice: number;
  currency: string;
  quantity: number;
  quantityUsed: number;
  override: { quantity: number; reason: string } | null;
  amount: number;
}

export interface EstimateTotals {
  direct: number;
  located: number;
  mobilisation: number;
  careOfWater: number;
  contingency: number;
  overheadAndProfit: number;
  escalation: number;
  total: number;
  accuracy: {
    aaceClass: number;
    lowPct: number;
    highPct: number;
    low: number;
    high: number;
    basis: string;
    source: string;
  };
}

export interface EstimateView {
  id: string;
  projectId: string;
  revision: number;
  status: 'draft' | 'issued';
  priceBook: { id: string; name: string; currency: string } | null;
  settings: EstimateSettings;
  mapping: Record<string, string>;
  takeoffLines: TakeoffLineView[];
  lines: EstimateLine[];
  unpriced: { key: string; reason: string }[];
  totals: EstimateTotals | null;
  steps: string[];
  pricedFrom: {
    designId: string;
    engineVersion: string | null;
    computedAt: string | null;
    designUpdatedAt: string;
  } | null;
  stale: boolean;
  problem: string | null;
  issuedAt: string | null;
  issuedBy: string | null;
  createdAt: string;
  audit: {
    at: string;
    by: string;
    key: string;
    oldQuantity: number | null;
    newQuantity: number | null;
    unit: string;
    reason: string;
  }[];
}

export interface RevisionSummary {
  id: string;
  revision: number;
  status: 'draft' | 'issued';
  issuedAt: string | null;
  total: number | null;
  createdAt: string;
}

const project = (id: string) => `/projects/${encodeURIComponent(id)}`;
const est = (id: string) => `/estimates/${encodeURIComponent(id)}`;

export const estimatesApi = {
  takeoff: (projectId: string, signal?: AbortSignal) =>
    request<TakeoffView>(`${project(projectId)}/takeoff`, { signal }),
  saveTakeoffOverrides: (projectId: string, overrides: Record<string, number | string>) =>
    request<TakeoffView>(`${project(projectId)}/takeoff/overrides`, {
      method: 'PUT',
      body: { overrides },
    }),
  list: (projectId: string, signal?: AbortSignal) =>
    request<{ items: RevisionSummary[] }>(`${project(projectId)}/estimates`, { signal }),
  create: (projectId: string, priceBookId?: string | null) =>
    request<EstimateView>(`${project(projectId)}/estimates`, {
      method: 'POST',
      body: priceBookId === undefined ? {} : { priceBookId },
    }),
  get: (id: string, signal?: AbortSignal) => request<EstimateView>(est(id), { signal }),
  update: (
    id: string,
    body: {
      priceBookId?: string | null;
      settings?: EstimateSettings;
      mapping?: Record<string, string>;
    },
  ) => request<EstimateView>(est(id), { method: 'PATCH', body }),
  override: (
    id: string,
    body: { key: string; quantity: number | null; unit?: string; reason: string },
  ) => request<EstimateView>(`${est(id)}/overrides`, { method: 'POST', body }),
  issue: (id: string) => request<EstimateView>(`${est(id)}/issue`, { method: 'POST' }),
  export: (id: string, format: 'csv' | 'xlsx') =>
    download(`${est(id)}/export`, { format }, `estimate.${format}`),
};
