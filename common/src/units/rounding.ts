// The one display-rounding rule (issue 7 item 3): how many decimals a quantity is shown with in
// tables, labels and charts, by kind and unit system, and the three significant figures of
// numbers inside sentences. The web's unitFormat and common/src/messages (formatQuantity) read it.
import type { QuantityKind } from './index';
import type { UnitSystem } from '../range/types';

/** Decimals in tables, labels and charts, by kind and unit system. */
export const DISPLAY_DECIMALS: Readonly<
  Record<QuantityKind, Readonly<Record<UnitSystem, number>>>
> = {
  length: { SI: 2, US: 2 },
  area: { SI: 2, US: 2 },
  volume: { SI: 2, US: 2 },
  earthwork: { SI: 2, US: 2 },
  discharge: { SI: 2, US: 2 },
  unitDischarge: { SI: 2, US: 2 },
  velocity: { SI: 2, US: 2 },
  force: { SI: 2, US: 2 },
  pressure: { SI: 2, US: 2 },
  power: { SI: 2, US: 2 },
  mass: { SI: 2, US: 2 },
  weirCoefficient: { SI: 2, US: 2 },
  lineLoad: { SI: 2, US: 2 },
  unitWeight: { SI: 2, US: 2 },
};

/** Decimals of a dimensionless number (Froude number, ratios) in tables. */
export const DIMENSIONLESS_DECIMALS = 2;

/** The decimals a value of `kind` (null: dimensionless) is shown with in `system`. */
export function displayDecimals(kind: QuantityKind | null, system: UnitSystem): number {
  return kind ? DISPLAY_DECIMALS[kind][system] : DIMENSIONLESS_DECIMALS;
}

/**
 * A value already in the user's units as a table or chart shows it: the decimals of its kind,
 * grouped thousands ('1,234.50'), '—' when missing.
 * @example displayText(1234.5, 'length', 'SI') // '1,234.50'
 */
export function displayText(
  value: number | null | undefined,
  kind: QuantityKind | null,
  system: UnitSystem,
  digits = displayDecimals(kind, system),
): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return groupedNumber(value, digits, digits);
}

// One formatter per pair of decimal limits: toLocaleString with options builds a new formatter
// on every call, which cost a table of seventy rows tens of milliseconds on a slow machine.
const NUMBER_FORMATS = new Map<string, Intl.NumberFormat>();

/**
 * A number with grouped thousands and at most `maxDigits` decimals (at least `minDigits`), as
 * every table of the app writes one: groupedNumber(1234.5678, 2) // '1,234.57'
 */
export function groupedNumber(value: number, maxDigits: number, minDigits = 0): string {
  const key = `${minDigits}:${maxDigits}`;
  let f = NUMBER_FORMATS.get(key);
  if (!f) {
    f = new Intl.NumberFormat('en-GB', {
      minimumFractionDigits: minDigits,
      maximumFractionDigits: maxDigits,
    });
    NUMBER_FORMATS.set(key, f);
  }
  return f.format(value);
}

/**
 * A number in a sentence: `figures` significant figures (three unless told), no trailing zeros,
 * never an exponent; '?' when not finite.
 * @example significant(49.2126, 3) // '49.2'
 */
export function significant(x: number, figures = 3): string {
  if (!Number.isFinite(x)) return '?';
  const a = Math.abs(x);
  if (a === 0) return '0';
  const decimals = Math.min(6, Math.max(0, figures - 1 - Math.floor(Math.log10(a))));
  const text = x.toFixed(decimals);
  return decimals > 0 ? text.replace(/\.?0+$/, '') : text;
}
