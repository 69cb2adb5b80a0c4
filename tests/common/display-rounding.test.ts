// The one display-rounding rule (common/src/units/rounding.ts): tables, labels and charts use
// the decimals of a quantity's kind and unit system; sentences three significant figures.
// Expected strings are the rule's own statement (common practice: two decimals in tables).
import { describe, expect, it } from 'vitest';
import {
  DISPLAY_DECIMALS,
  displayDecimals,
  displayText,
  formatQuantity,
  groupedNumber,
  significant,
  type QuantityKind,
} from '../../common/src';

describe('one display-rounding rule', () => {
  it('every kind has its decimals in both unit systems', () => {
    for (const kind of Object.keys(DISPLAY_DECIMALS) as QuantityKind[]) {
      expect(Number.isInteger(displayDecimals(kind, 'SI'))).toBe(true);
      expect(Number.isInteger(displayDecimals(kind, 'US'))).toBe(true);
    }
  });
  it('tables and labels: the decimals of the kind, thousands grouped, a dash when missing', () => {
    expect(displayText(1234.5, 'length', 'SI')).toBe('1,234.50');
    expect(displayText(0.304, 'length', 'US')).toBe('0.30');
    expect(displayText(3.14159, 'length', 'SI', 3)).toBe('3.142');
    expect(displayText(null, 'discharge', 'US')).toBe('—');
    expect(displayText(Number.NaN, null, 'SI')).toBe('—');
  });
  it('table numbers with at most (and at least) so many decimals: the platform’s own per-call formatting', () => {
    expect(groupedNumber(1234.5678, 2)).toBe('1,234.57');
    expect(groupedNumber(1234.5, 2, 2)).toBe('1,234.50');
    expect(groupedNumber(0.125, 4)).toBe('0.125');
    expect(groupedNumber(-98765.4, 0)).toBe('-98,765');
    // the cached formatter answers as toLocaleString with the same options does, call after call
    for (const [v, max, min] of [
      [1e7 / 3, 2, 0],
      [2.5, 0, 0],
      [1e-5, 4, 0],
      [42, 2, 2],
    ] as const)
      for (let i = 0; i < 2; i++)
        expect(groupedNumber(v, max, min)).toBe(
          v.toLocaleString('en-GB', { minimumFractionDigits: min, maximumFractionDigits: max }),
        );
  });
  it('sentences: three significant figures (lengths to the hundredth), in formatQuantity too', () => {
    expect(significant(49.2126)).toBe('49.2');
    expect(significant(123.4)).toBe('123');
    expect(significant(0.3048)).toBe('0.305');
    expect(significant(5)).toBe('5');
    // 15 m/s in US: 15 / 0.3048 = 49.2126 ft/s [NIST SP 811], three figures
    expect(formatQuantity(15, 'velocity', 'US')).toBe('49.2 ft/s');
    expect(formatQuantity(0.3048, 'length', 'US')).toBe('1.00 ft');
  });
});
