// Scour protection: riprap below an end sill, and riprap aprons at culvert outlets. SI.
import { InputError } from '../errors';
import { G } from '../units/constants';
import { BASIN_DEFAULTS } from './defaults';
import { reqPositive, roundUp } from './guards';
import { qty, warn, type StudyWarning } from '../warnings';

/**
 * Isbash stone size, m: D = V²/(2g·C²·(Gs − 1)); C = 0.86 for high turbulence (below a
 * basin), 1.20 for low turbulence [src: Isbash, via HEC-14 and USACE].
 * @example isbashStoneSize(4) // ≈ 0.668 m (g = 9.81)
 */
export function isbashStoneSize(
  velocity: number,
  opts: { coefficient?: number; specificGravity?: number; g?: number } = {},
): number {
  const V = reqPositive('velocity', velocity);
  const C = reqPositive(
    'coefficient (Isbash C)',
    opts.coefficient ?? BASIN_DEFAULTS.isbashCoefficient,
  );
  const Gs = opts.specificGravity ?? BASIN_DEFAULTS.stoneSpecificGravity;
  if (!Number.isFinite(Gs) || Gs <= 1)
    throw new InputError(
      'specificGravity',
      'not-above',
      `specificGravity must be greater than 1 (got ${Gs})`,
      { min: 1 },
    );
  const g = reqPositive('g', opts.g ?? G);
  return (V * V) / (2 * g * C * C * (Gs - 1));
}

/**
 * Median stone size from the velocity alone, SI: D50 = 0.0413·V² (m, V in m/s)
 * [src: HEC-14 App. D].
 * @example velocityStoneSize(4) // 0.661 m
 */
export function velocityStoneSize(velocity: number): number {
  const V = reqPositive('velocity', velocity);
  return 0.0413 * V * V;
}

export interface CulvertApronStone {
  /** median stone size, m */
  d50: number;
  /** tailwater used in the relation, m (bounded to 0.4·D–1.0·D) */
  tailwaterUsed: number;
  warnings: StudyWarning[];
}

/**
 * Riprap apron stone at a culvert outlet [src: HEC-14 eq. 10.4]:
 * D50 = 0.2·D·(Q/(√g·D^2.5))^(4/3)·(D/TW), valid for 0.4·D ≤ TW ≤ D. Unknown tailwater is
 * taken as 0.4·D; tailwater outside the bounds is held at the bound and said. For a box
 * culvert D = rise and Q/(√g·D^2.5) is replaced by q/(√g·D^1.5), q = Q/span [mem: HEC-14].
 * @example culvertApronStoneSize({ Q: 3, rise: 1.2 }).d50 // ≈ 0.3085 m
 */
export function culvertApronStoneSize(c: {
  Q: number;
  rise: number;
  span?: number;
  shape?: 'circular' | 'box';
  tailwater?: number;
  g?: number;
}): CulvertApronStone {
  const Q = reqPositive('Q', c.Q);
  const D = reqPositive('rise (culvert diameter or rise)', c.rise);
  const g = reqPositive('g', c.g ?? G);
  const at = { type: 'riprap-apron' as const };
  const warnings: StudyWarning[] = [];
  let tw: number;
  if (c.tailwater === undefined) {
    tw = 0.4 * D;
    warnings.push(warn('apron-tailwater-assumed', {}, at));
  } else {
    if (!Number.isFinite(c.tailwater) || c.tailwater < 0)
      throw new InputError(
        'tailwater',
        'negative',
        `tailwater must be a non-negative finite number (got ${c.tailwater})`,
        {},
      );
    tw = Math.min(D, Math.max(0.4 * D, c.tailwater));
    if (tw !== c.tailwater) {
      warnings.push(
        warn(
          'apron-tailwater-held',
          {
            tw: qty('length', c.tailwater),
            low: qty('length', 0.4 * D),
            rise: qty('length', D),
            used: qty('length', tw),
          },
          at,
        ),
      );
    }
  }
  let param: number;
  if (c.shape === 'box') {
    const span = reqPositive('span (box culvert width)', c.span);
    param = Q / span / (Math.sqrt(g) * Math.pow(D, 1.5));
  } else {
    param = Q / (Math.sqrt(g) * Math.pow(D, 2.5));
  }
  return { d50: 0.2 * D * Math.pow(param, 4 / 3) * (D / tw), tailwaterUsed: tw, warnings };
}

/** Riprap apron classes [mem: HEC-14 Table 10.1]: D50 limit (m), length (× D), thickness (× D50). */
export const APRON_CLASSES: ReadonlyArray<{
  cls: number;
  d50: number;
  lengthRatio: number;
  thicknessRatio: number;
}> = [
  { cls: 1, d50: 0.125, lengthRatio: 4, thicknessRatio: 3.5 },
  { cls: 2, d50: 0.15, lengthRatio: 4, thicknessRatio: 3.3 },
  { cls: 3, d50: 0.25, lengthRatio: 5, thicknessRatio: 2.4 },
  { cls: 4, d50: 0.35, lengthRatio: 6, thicknessRatio: 2.2 },
  { cls: 5, d50: 0.5, lengthRatio: 7, thicknessRatio: 2.0 },
  { cls: 6, d50: 0.55, lengthRatio: 8, thicknessRatio: 2.0 },
];

export interface RiprapProtection {
  /** design velocity leaving the basin, m/s */
  velocity: number;
  /** Isbash stone size, m */
  d50Isbash: number;
  /** velocity-only stone size, m */
  d50Velocity: number;
  /** the larger of the two, rounded up to 0.05 m */
  d50: number;
  /** layer thickness ≥ 2·D50 [src], m */
  thickness: number;
  /** length of protection below the sill, m */
  length: number;
  /** width of protection, m */
  width: number;
  bedding: string;
  sources: string[];
}

/**
 * Riprap below an end sill: stone by Isbash (turbulent C) and by the velocity-only relation,
 * the larger governs; layer 2·D50 [src: HEC-14]; length riprapLengthRatio·y2 (default 5·y2,
 * within the 4–6·y2 habit) [mem].
 * @example riprapBelowSill({ velocity: 3, y2: 4, width: 12 }).thickness
 */
export function riprapBelowSill(c: {
  velocity: number;
  y2: number;
  width: number;
  coefficient?: number;
  specificGravity?: number;
  lengthRatio?: number;
  minThickness?: number;
}): RiprapProtection {
  const V = reqPositive('velocity', c.velocity);
  const y2 = reqPositive('y2', c.y2);
  const width = reqPositive('width', c.width);
  const isb = isbashStoneSize(V, {
    ...(c.coefficient !== undefined ? { coefficient: c.coefficient } : {}),
    ...(c.specificGravity !== undefined ? { specificGravity: c.specificGravity } : {}),
  });
  const vel = velocityStoneSize(V);
  const d50 = roundUp(Math.max(isb, vel), 0.05);
  const thickness = Math.max(2 * d50, c.minThickness ?? BASIN_DEFAULTS.riprapMinThickness);
  return {
    velocity: V,
    d50Isbash: isb,
    d50Velocity: vel,
    d50,
    thickness,
    length: (c.lengthRatio ?? BASIN_DEFAULTS.riprapLengthRatio) * y2,
    width,
    bedding:
      'Place the riprap on a graded granular filter (or a geotextile with a granular cushion), ' +
      'designed by filter criteria against the bed material (common practice); key the upstream edge ' +
      'into the end-sill cutoff and the toe into the bed.',
    sources: [
      'Isbash D = V²/(2g·C²·(Gs − 1)), C = 0.86 turbulent [src: Isbash via HEC-14]',
      'D50 = 0.0413·V² [src: HEC-14 App. D]',
      'layer thickness ≥ 2·D50 [src: HEC-14]',
      'length of protection ≈ 4–6·y2 (default 5·y2) [mem]',
    ],
  };
}

export interface CulvertApron {
  d50: number;
  /** apron class, or undefined when the stone exceeds the largest class */
  cls: number | undefined;
  length: number;
  thickness: number;
  /** width at the outlet and at the downstream end, m */
  widthAtOutlet: number;
  widthAtEnd: number;
  tailwaterUsed: number;
  warnings: StudyWarning[];
  sources: string[];
}

/**
 * Riprap apron at a culvert outlet: stone by HEC-14 eq. 10.4, class, length and thickness by
 * class [mem: HEC-14 Table 10.1]; width 3·D at the outlet widening by the apron length × 2/3
 * (common practice, HEC-14 figure from memory).
 */
export function designCulvertApron(c: {
  Q: number;
  rise: number;
  span?: number;
  shape?: 'circular' | 'box';
  tailwater?: number;
}): CulvertApron {
  const stone = culvertApronStoneSize(c);
  const warnings = [...stone.warnings];
  const klass = APRON_CLASSES.find((k) => stone.d50 <= k.d50 + 1e-12);
  const use = klass ?? APRON_CLASSES[APRON_CLASSES.length - 1]!;
  if (!klass)
    warnings.push(
      warn(
        'apron-stone-beyond-classes',
        { d50: qty('length', stone.d50), max: qty('length', use.d50) },
        { type: 'riprap-apron' },
      ),
    );
  const D = c.rise;
  const length = use.lengthRatio * D;
  const outlet = Math.max(3 * D, c.span ?? 0);
  return {
    d50: stone.d50,
    cls: klass?.cls,
    length,
    thickness: use.thicknessRatio * Math.max(stone.d50, use.d50),
    widthAtOutlet: outlet,
    widthAtEnd: outlet + (2 / 3) * length,
    tailwaterUsed: stone.tailwaterUsed,
    warnings,
    sources: [
      'D50 = 0.2·D·(Q/(√g·D^2.5))^(4/3)·(D/TW), 0.4·D ≤ TW ≤ D [src: HEC-14 eq. 10.4]',
      'classes, lengths 4·D–8·D and thicknesses by class [mem: HEC-14 Table 10.1]',
      'width 3·D at the outlet, widening by 2/3 of the length (common practice)',
    ],
  };
}
