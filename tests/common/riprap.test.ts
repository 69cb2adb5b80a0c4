// Exit protection and slab flotation. Sources beside each check.
import { describe, expect, it } from 'vitest';
import {
  APRON_CLASSES,
  culvertApronStoneSize,
  designCulvertApron,
  isbashStoneSize,
  riprapBelowSill,
  slabFlotation,
  velocityStoneSize,
} from '../../common/src/basins';
import { studyWarningText } from '../../common/src/messages';
import { expectRel } from '../support/tolerance';

describe('riprap stone', () => {
  it('Isbash V 4 m/s, Gs 2.65 → 0.668 m (C 0.86), 0.343 m (C 1.20) [calc: hydraulics.md §6, g 9.81; relation src: Isbash]', () => {
    expectRel(isbashStoneSize(4, { g: 9.81 }), 0.668, 0.005);
    expectRel(isbashStoneSize(4, { g: 9.81, coefficient: 1.2 }), 0.343, 0.005);
  });
  it('velocity-only D50 = 0.0413·V² [src: HEC-14 App. D]: 0.6608 m at 4 m/s', () => {
    expectRel(velocityStoneSize(4), 0.6608, 1e-12);
  });
  it('culvert apron Q 3, D 1.2, tailwater unknown (0.4·D) → D50 0.3085 m [calc from HEC-14 eq. 10.4]', () => {
    const s = culvertApronStoneSize({ Q: 3, rise: 1.2, g: 9.81 });
    expectRel(s.d50, 0.3085, 0.005);
    expectRel(s.tailwaterUsed, 0.48, 1e-12);
    expect(s.warnings.map((w) => w.code)).toEqual(['apron-tailwater-assumed']);
    expect(studyWarningText(s.warnings[0]!)).toMatch(/0\.4·D/);
  });
  it('apron tailwater held to 0.4·D–1.0·D [src: HEC-14 eq. 10.4]: TW 2 m on D 1.2 uses 1.2 (D50 = 0.4 × the 0.4·D value)', () => {
    const lo = culvertApronStoneSize({ Q: 3, rise: 1.2 });
    const hi = culvertApronStoneSize({ Q: 3, rise: 1.2, tailwater: 2 });
    expectRel(hi.tailwaterUsed, 1.2, 1e-12);
    expectRel(hi.d50, lo.d50 * 0.4, 1e-12);
    expect(hi.warnings).toHaveLength(1);
  });
  it('apron class, length 4D–8D and thickness by class [from memory: HEC-14 Table 10.1]', () => {
    const a = designCulvertApron({ Q: 3, rise: 1.2 });
    expect(a.cls).toBe(4); // 0.25 < 0.3086 ≤ 0.35
    expectRel(a.length, 6 * 1.2, 1e-12);
    expectRel(a.thickness, 2.2 * 0.35, 1e-12);
    expect(APRON_CLASSES.map((c) => c.lengthRatio)).toEqual([4, 4, 5, 6, 7, 8]);
    const big = designCulvertApron({ Q: 12, rise: 1.2 });
    expect(big.cls).toBeUndefined();
    expect(big.warnings.map((w) => w.code)).toContain('apron-stone-beyond-classes');
  });
  it('below a sill: the larger of Isbash and velocity-only governs, rounded up to 0.05 m; layer ≥ 2·D50 [src: HEC-14]; length 5·y2 [from memory]', () => {
    const r = riprapBelowSill({ velocity: 4, y2: 3, width: 12 });
    expectRel(r.d50Isbash, 0.6685, 0.002);
    expectRel(r.d50, 0.7, 1e-9);
    expectRel(r.thickness, 1.4, 1e-12);
    expectRel(r.length, 15, 1e-12);
    expect(r.bedding).toMatch(/filter/);
  });
  it('refuses impossible input', () => {
    expect(() => isbashStoneSize(0)).toThrow(/velocity/);
    expect(() => isbashStoneSize(3, { specificGravity: 1 })).toThrow(/specificGravity/);
    expect(() => culvertApronStoneSize({ Q: 3, rise: -1 })).toThrow(/rise/);
    expect(() => culvertApronStoneSize({ Q: 3, rise: 1, shape: 'box' })).toThrow(/span/);
  });
});

describe('slab flotation (statics; safety factor 1.3 usual loading from memory: USACE)', () => {
  it('slab alone, 2 m uplift head: t ≥ 1.3·9.81·2/(23.5 − 1.3·9.81) = 2.3733 m → 2.40 m, factor 1.3066 [calc]', () => {
    const r = slabFlotation({
      floorElevation: 100,
      upliftElevation: 102,
      width: 10,
      monolithic: false,
    });
    expectRel(r.requiredThickness, 2.373313482832419, 1e-9);
    expectRel(r.thickness, 2.4, 1e-9);
    expectRel(r.safetyFactorAchieved!, 1.3066444259104806, 1e-9);
    expect(r.governedBy).toBe('flotation');
    expect(r.notes.map((n) => n.code)).toEqual(['slab-thick']);
    expect(studyWarningText(r.notes[0]!)).toMatch(/drains/);
  });
  it('monolithic walls (0.5 × 5 m) help: t = 2.5660 m → 2.60 m, factor 1.3066 [calc]', () => {
    const r = slabFlotation({
      floorElevation: 0,
      upliftElevation: 3,
      width: 10,
      wallThickness: 0.5,
      wallHeight: 5,
    });
    expectRel(r.requiredThickness, 2.5660353417867148, 1e-9);
    expectRel(r.thickness, 2.6, 1e-9);
    expectRel(r.safetyFactorAchieved!, 1.3066444259104808, 1e-9);
  });
  it('no uplift: the minimum thickness governs and no factor is reported', () => {
    const r = slabFlotation({ floorElevation: 100, upliftElevation: 99, width: 10 });
    expect(r.thickness).toBe(0.3);
    expect(r.governedBy).toBe('minimum');
    expect(r.safetyFactorAchieved).toBeNull();
  });
  it('an impossible factor is refused with a reason', () => {
    expect(() =>
      slabFlotation({ floorElevation: 0, upliftElevation: 2, width: 10, safetyFactor: 3 }),
    ).toThrow(/anchor/);
    expect(() =>
      slabFlotation({ floorElevation: Number.NaN, upliftElevation: 2, width: 10 }),
    ).toThrow(/floorElevation/);
  });
});
