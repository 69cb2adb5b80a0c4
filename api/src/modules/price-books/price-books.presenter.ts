import type { PriceBook, PriceBookItem } from '../../models';

export interface PriceBookItemView {
  code: string;
  description: string;
  unit: string;
  unitPrice: number;
  currency: string;
  source: string;
  dateNote: string;
}

export interface PriceBookView {
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

export function presentItem(item: PriceBookItem): PriceBookItemView {
  return {
    code: item.code,
    description: item.description,
    unit: item.unit,
    // NUMERIC arrives as a decimal string; four decimals survive a double exactly enough.
    unitPrice: Number(item.unitPrice),
    currency: item.currency,
    source: item.source,
    dateNote: item.dateNote,
  };
}

export function presentPriceBook(book: PriceBook, itemCount?: number): PriceBookView {
  return {
    id: book.id,
    name: book.name,
    currency: book.currency,
    notes: book.notes,
    archived: book.archivedAt !== null,
    archivedAt: book.archivedAt?.toISOString() ?? null,
    itemCount: itemCount ?? book.items?.length ?? 0,
    createdAt: book.createdAt.toISOString(),
    updatedAt: book.updatedAt.toISOString(),
  };
}

export function presentPriceBookWithItems(
  book: PriceBook,
): PriceBookView & { items: PriceBookItemView[]; takeoffMapping: Record<string, string> } {
  return {
    ...presentPriceBook(book),
    items: (book.items ?? []).map(presentItem),
    takeoffMapping: book.takeoffMapping ?? {},
  };
}
