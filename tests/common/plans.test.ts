// The one plan table (common/src/plans.ts) against the product brief's Plans table
// (../shared/design/product.md): Concept free, 1 seat, 3 projects, watermarked and unbranded;
// Professional per seat, unlimited projects, branded proposals, price-book import; Firm per
// seat with 3 or more, several price books, alternatives comparison export.
// And the brand colour's contrast against white text (WCAG 2.x definitions).
import { describe, expect, it } from 'vitest';
import {
  PLAN_FEATURES,
  PLAN_LIMITS,
  PLAN_ORDER,
  allowedWhileReadOnly,
  brandUpdateSchema,
  contrastRatio,
  contrastWithWhite,
  featureLiftedBy,
  formatContrast,
  limitFor,
  limitLiftedBy,
  limitReachedText,
  minimumSeats,
  planAllows,
  seatLimit,
} from '@basinwright/common';
import { expectRel } from '../support/tolerance';

describe('the plan table follows the product brief', () => {
  it('Concept: 1 seat, 3 projects, no branding (watermark), no price-book import', () => {
    expect(limitFor('concept', 'seats')).toBe(1);
    expect(limitFor('concept', 'projects')).toBe(3);
    for (const feature of PLAN_FEATURES) expect(planAllows('concept', feature)).toBe(false);
  });

  it('Professional: per seat, unlimited projects, branded proposals and price-book import, one price book', () => {
    expect(limitFor('professional', 'seats')).toBeNull();
    expect(limitFor('professional', 'projects')).toBeNull();
    expect(planAllows('professional', 'brandedProposals')).toBe(true);
    expect(planAllows('professional', 'priceBookImport')).toBe(true);
    expect(planAllows('professional', 'severalPriceBooks')).toBe(false);
    expect(planAllows('professional', 'alternativesExport')).toBe(false);
    expect(limitFor('professional', 'priceBooks')).toBe(1);
  });

  it('Firm: 3 seats or more, everything, several price books', () => {
    expect(minimumSeats('firm')).toBe(3);
    for (const feature of PLAN_FEATURES) expect(planAllows('firm', feature)).toBe(true);
    expect(limitFor('firm', 'priceBooks')).toBeNull();
  });

  it('names the smallest plan that lifts each limit or feature', () => {
    expect(featureLiftedBy('brandedProposals')).toBe('professional');
    expect(featureLiftedBy('priceBookImport')).toBe('professional');
    expect(featureLiftedBy('severalPriceBooks')).toBe('firm');
    expect(featureLiftedBy('alternativesExport')).toBe('firm');
    expect(limitLiftedBy('projects', 'concept')).toBe('professional');
    expect(limitLiftedBy('seats', 'concept')).toBe('professional');
    expect(limitLiftedBy('seats', 'professional')).toBeNull(); // buy seats instead
    expect(limitLiftedBy('priceBooks', 'professional')).toBe('firm');
    expect(limitReachedText('concept', 'projects', 3)).toBe(
      'The Concept plan holds up to 3 projects. Upgrade to Professional for more.',
    );
  });

  it('keeps the older face (PLAN_LIMITS, seatLimit) in step with the table', () => {
    for (const plan of PLAN_ORDER) {
      expect(PLAN_LIMITS[plan].maxProjects).toBe(limitFor(plan, 'projects'));
      expect(PLAN_LIMITS[plan].maxSeats).toBe(limitFor(plan, 'seats'));
    }
    expect(seatLimit('concept', 5)).toBe(1);
    expect(seatLimit('firm', 7)).toBe(7);
  });

  it('while read only for billing, only billing, signing out and one’s own profile may write', () => {
    expect(allowedWhileReadOnly('billing.checkout')).toBe(true);
    expect(allowedWhileReadOnly('session.end')).toBe(true);
    expect(allowedWhileReadOnly('projects.create')).toBe(false);
    expect(allowedWhileReadOnly('brand.update')).toBe(false);
  });
});

describe('contrast of white text on the brand colour (WCAG 2.x)', () => {
  it('matches the definition’s end points and widely published figures', () => {
    // Black on white is 21:1 and a colour on itself 1:1, by the definition.
    expectRel(contrastRatio('#000000', '#ffffff'), 21, 1e-12);
    expectRel(contrastWithWhite('#ffffff'), 1, 1e-12);
    // Widely published pair: white on #767676 is 4.54:1 (the lightest grey meeting 4.5:1),
    // on #777777 4.48:1.
    expectRel(contrastWithWhite('#767676'), 4.54, 0.001);
    expectRel(contrastWithWhite('#777777'), 4.48, 0.001);
    // Rounded down for display, so a colour just under the line never reads 4.50.
    expect(formatContrast(4.4999)).toBe('4.49');
  });

  it('the shared schema refuses a colour below 4.5:1 and quotes its ratio', async () => {
    await expect(brandUpdateSchema.validate({ color: '#767676' })).resolves.toBeTruthy();
    await expect(brandUpdateSchema.validate({ color: '#777777' })).rejects.toThrow(
      /contrast of 4\.47:1; it needs at least 4\.5:1/,
    );
    await expect(brandUpdateSchema.validate({})).rejects.toThrow(/Change the colour/);
    const cleared = await brandUpdateSchema.validate({ color: '', footer: '  ' });
    expect(cleared).toEqual({ color: null, footer: null });
  });
});
