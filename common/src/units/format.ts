// Numbers in the user's units for tables, labels, charts and the proposal: one formatter read
// by the web app and the PDF, on the one rounding rule (rounding.ts).
import type { UnitSystem } from '../range/types';
import { fromSIValue, UNIT_LABELS, type QuantityKind } from './index';
import { displayText } from './rounding';

/**
 * Formats SI values in `units`: `label(kind)` the unit, `value` the converted number,
 * `num` the table text, `withUnit` the text with its unit, `shown` a value already converted.
 * @example unitFormat('US').withUnit(0.3048, 'length') // '1.00 ft'
 */
export function unitFormat(units: UnitSystem) {
  const label = (kind: QuantityKind): string => UNIT_LABELS[kind][units];
  const value = (si: number, kind: QuantityKind): number => fromSIValue(si, kind, units);
  const num = (
    si: number | null | undefined,
    kind: QuantityKind | null,
    digits?: number,
  ): string =>
    si === null || si === undefined || !Number.isFinite(si)
      ? '—'
      : displayText(kind ? value(si, kind) : si, kind, units, digits);
  const withUnit = (si: number | null | undefined, kind: QuantityKind, digits?: number): string =>
    si === null || si === undefined || !Number.isFinite(si)
      ? '—'
      : `${num(si, kind, digits)} ${label(kind)}`;
  /** a value already in the user's units (chart axes and labels), with its unit */
  const shown = (v: number, kind: QuantityKind): string =>
    `${displayText(v, kind, units)} ${label(kind)}`;
  return { label, value, num, withUnit, shown };
}
export type UnitFormat = ReturnType<typeof unitFormat>;
