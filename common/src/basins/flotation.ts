// Floor slab thickness by flotation: slab weight (plus walls when monolithic, plus water on the
// slab) against uplift, with a safety factor. Per metre of basin length; SI (m, kN).
import { InputError } from '../errors';
import { BASIN_DEFAULTS } from './defaults';
import { reqFinite, reqNonNegative, reqPositive, roundUp } from './guards';
import { qty, warn, type StudyWarning } from '../warnings';

export interface FlotationCase {
  /** basin floor (top of slab) elevation, m */
  floorElevation: number;
  /** elevation of the groundwater or tailwater that drives uplift under the slab, m */
  upliftElevation: number;
  /** water standing on the slab in this case, m (0 = basin dewatered) */
  waterOnSlabDepth?: number;
  /** clear width between the walls, m */
  width: number;
  /** walls cast with the slab: their weight counts and the slab runs under them */
  monolithic?: boolean;
  wallThickness?: number;
  /** wall height above the floor, m */
  wallHeight?: number;
  /** default 1.3, usual loading [mem: USACE] */
  safetyFactor?: number;
  /** least slab thickness, m (default 0.3, common practice) */
  minThickness?: number;
  /** kN/m³ (default 23.5, common practice) */
  concreteUnitWeight?: number;
  /** kN/m³ (default 9.81) */
  waterUnitWeight?: number;
  /** share of the full uplift head acting (1 = no drains; drains reduce it) */
  upliftFactor?: number;
  /** thickness step, m (default 0.05) */
  step?: number;
}

export interface FlotationResult {
  /** slab thickness adopted, m (rounded up to the step, at least the minimum) */
  thickness: number;
  /** thickness the flotation check alone needs, m (0 when there is no net uplift) */
  requiredThickness: number;
  governedBy: 'flotation' | 'minimum';
  /** uplift head at the underside of the adopted slab, m */
  upliftHead: number;
  /** resisting / uplift at the adopted thickness; null when there is no uplift */
  safetyFactorAchieved: number | null;
  safetyFactorRequired: number;
  /** per metre of basin length, kN/m */
  resisting: number;
  uplift: number;
  /** as data (slab-thick, uplift-below-floor) */
  notes: StudyWarning[];
}

/**
 * Slab thickness against flotation, per metre of basin length [relation: statics; safety
 * factor 1.3 usual loading, mem: USACE]: with B the base width (W + 2·walls when monolithic),
 * H the uplift head above the floor and t the slab thickness,
 * γc·B·t + walls + γw·d·W ≥ FS·γw·k·B·(H + t). Solved for t, rounded up, ≥ the minimum.
 * @example slabFlotation({ floorElevation: 0, upliftElevation: 2, width: 10 }).thickness
 */
export function slabFlotation(c: FlotationCase): FlotationResult {
  const zf = reqFinite('floorElevation', c.floorElevation);
  const zu = reqFinite('upliftElevation', c.upliftElevation);
  const W = reqPositive('width', c.width);
  const d = reqNonNegative('waterOnSlabDepth', c.waterOnSlabDepth ?? 0);
  const mono = c.monolithic ?? true;
  const tw = mono
    ? reqNonNegative('wallThickness', c.wallThickness ?? BASIN_DEFAULTS.minWallThickness)
    : 0;
  const hw = mono ? reqNonNegative('wallHeight', c.wallHeight ?? 0) : 0;
  const FS = reqPositive('safetyFactor', c.safetyFactor ?? BASIN_DEFAULTS.flotationSafetyFactor);
  const tMin = reqPositive('minThickness', c.minThickness ?? BASIN_DEFAULTS.minSlabThickness);
  const gc = reqPositive(
    'concreteUnitWeight',
    c.concreteUnitWeight ?? BASIN_DEFAULTS.concreteUnitWeight,
  );
  const gw = reqPositive('waterUnitWeight', c.waterUnitWeight ?? BASIN_DEFAULTS.waterUnitWeight);
  const k = reqNonNegative('upliftFactor', c.upliftFactor ?? BASIN_DEFAULTS.upliftFactor);
  const step = reqPositive('step', c.step ?? 0.05);
  const B = W + 2 * tw;
  const H = zu - zf;
  const walls = 2 * gc * tw * hw;
  const water = gw * d * W;
  const notes: StudyWarning[] = [];
  const denom = B * (gc - FS * gw * k);
  if (denom <= 0) {
    throw new InputError(
      'safetyFactor',
      'slab-cannot-hold',
      `safetyFactor ${FS}: concrete (${gc} kN/m³) cannot outweigh ${FS} × the uplift whatever its thickness; reduce uplift (drains) or anchor the slab`,
      { safetyFactor: FS, unitWeight: gc },
    );
  }
  const need = Math.max(0, (FS * gw * k * B * H - walls - water) / denom);
  const thickness = Math.max(tMin, roundUp(need, step));
  const upliftHead = Math.max(0, H + thickness);
  const uplift = gw * k * B * upliftHead;
  const resisting = gc * B * thickness + walls + water;
  if (need > 1.0)
    notes.push(
      warn('slab-thick', { need: qty('length', need), thickness: qty('length', thickness) }),
    );
  if (H <= 0) notes.push(warn('uplift-below-floor'));
  return {
    thickness,
    requiredThickness: need,
    governedBy: need > tMin ? 'flotation' : 'minimum',
    upliftHead,
    safetyFactorAchieved: uplift > 0 ? resisting / uplift : null,
    safetyFactorRequired: FS,
    resisting,
    uplift,
    notes,
  };
}
