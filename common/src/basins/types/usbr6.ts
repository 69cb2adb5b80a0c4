// USBR Type VI impact basin: a box with a hanging baffle at a pipe outlet; needs no tailwater.
import { G } from '../../units/constants';
import { BASIN_DEFAULTS, type BasinDefaults } from '../defaults';
import { reqNonNegative, reqPositive, roundUp } from '../guards';
import type { DissipatorModule } from '../types';
import { warn, type StudyWarning } from '../../warnings';
import { crit, debrisCriterion, designRow, dis, len, lim, published, vel } from './shared';
import { DISSIPATOR_NAMES } from '../names';

const TAG = '[src: HEC-14 (2006) §9.4]';

export interface ImpactBasinSizing {
  type: 'usbr-6';
  /** equivalent depth of the entering jet ye = √(A/2), m [src: HEC-14] */
  equivalentDepth: number;
  /** Froude number on the equivalent depth */
  fr: number;
  /** width from the curve, m (before any user width) */
  curveWidth: number;
  /** basin width used, m */
  width: number;
  /** proportions of W [src: HEC-14 table]; meanings as read from the figure [mem] */
  wallHeight: number; // h1 ≈ 0.77·W
  baffleHeight: number; // h2 = 3/8·W
  baffleClearance: number; // h3 ≈ W/6, floor to the bottom of the hanging baffle
  endWallHeight: number; // h4 ≈ 5/12·W
  length: number; // L ≈ 4/3·W
  baffleDistance: number; // L1 ≈ 7/12·W, entrance to the baffle
  endSill: { height: number; length: number }; // ≈ W/12 [mem]
  /** the tailwater depth above the floor above which the baffle is overtopped, m [mem] */
  maxTailwaterDepth: number;
  warnings: StudyWarning[];
  sources: string[];
}

/**
 * Sizes a USBR Type VI impact basin from the entering flow: ye = √(A/2), Fr = V/√(g·ye)
 * [src: HEC-14]; W/ye = 2.88·Fr^0.566 (a fit of the HEC-14 width curve, from memory —
 * check against the curve, override with `width`); every other dimension in proportion to W
 * [src: HEC-14 table: h1 ≈ 0.77W, h2 = 0.375W, h3 ≈ W/6, h4 ≈ 5W/12, L ≈ 4W/3, L1 ≈ 7W/12].
 * @example sizeImpactBasin({ Q: 3, velocity: 6 }).width
 */
export function sizeImpactBasin(
  c: { Q: number; velocity: number; width?: number; tailwaterDepth?: number },
  d: BasinDefaults = { ...BASIN_DEFAULTS },
): ImpactBasinSizing {
  const Q = reqPositive('Q', c.Q);
  const V = reqPositive('velocity (entering velocity)', c.velocity);
  const A = Q / V;
  const ye = Math.sqrt(A / 2);
  const fr = V / Math.sqrt(G * ye);
  const curveWidth = ye * d.type6WidthCoefficient * Math.pow(fr, d.type6WidthExponent);
  const W = c.width !== undefined ? reqPositive('width', c.width) : roundUp(curveWidth, 0.05);
  const at = { type: 'usbr-6' as const };
  const warnings: StudyWarning[] = [warn('type6-width-from-memory', {}, at)];
  if (W < curveWidth * 0.999)
    warnings.push(warn('type6-narrower', { width: len(W), curveWidth: len(curveWidth) }, at));
  if (Q > d.type6MaxDischarge)
    warnings.push(
      warn('type6-discharge-above', { Q: dis(Q), limit: lim(d, 'type6MaxDischarge') }, at),
    );
  if (V > d.type6MaxVelocity)
    warnings.push(
      warn('type6-velocity-above', { v: vel(V), limit: lim(d, 'type6MaxVelocity') }, at),
    );
  const baffleHeight = 0.375 * W;
  const baffleClearance = W / 6;
  const maxTw = baffleClearance + baffleHeight / 2;
  if (
    c.tailwaterDepth !== undefined &&
    reqNonNegative('tailwaterDepth', c.tailwaterDepth) > maxTw
  ) {
    warnings.push(
      warn('type6-baffle-overtopped', { tw: len(c.tailwaterDepth), max: len(maxTw) }, at),
    );
  }
  return {
    type: 'usbr-6',
    equivalentDepth: ye,
    fr,
    curveWidth,
    width: W,
    wallHeight: 0.77 * W,
    baffleHeight,
    baffleClearance,
    endWallHeight: (5 / 12) * W,
    length: (4 / 3) * W,
    baffleDistance: (7 / 12) * W,
    endSill: { height: W / 12, length: W / 12 },
    maxTailwaterDepth: maxTw,
    warnings,
    sources: [
      'ye = √(A/2), Fr = V/√(g·ye) [src: HEC-14]',
      `W/ye = ${d.type6WidthCoefficient}·Fr^${d.type6WidthExponent} [mem: fit of the HEC-14 width curve]`,
      'h1 ≈ 0.77W, h2 = 0.375W, h3 ≈ W/6, h4 ≈ 5W/12, L ≈ 4W/3, L1 ≈ 7W/12 [src: HEC-14 table]; meanings of h1–h4 as read from the figure [mem]',
      'end sill ≈ W/12 [mem: HEC-14 table]; tailwater above h3 + h2/2 overtops the baffle [mem]',
    ],
  };
}

export const usbr6: DissipatorModule = {
  id: 'usbr-6',
  name: DISSIPATOR_NAMES['usbr-6'],
  source: 'USBR (Beichley 1957, ASCE); FHWA HEC-14 (2006) §9.4',
  family: 'impact-basin',
  description:
    'A compact box with a hanging baffle at a pipe or small chute outlet; works without tailwater.',
  limits: [
    {
      criterion: 'discharge',
      text: 'Q up to {Q}',
      quotes: { Q: published('type6MaxDischarge') },
      tag: TAG,
    },
    {
      criterion: 'velocity',
      text: 'entering velocity up to {v}',
      quotes: { v: published('type6MaxVelocity') },
      tag: TAG,
    },
    {
      criterion: 'tailwater',
      text: 'needs no tailwater; tailwater above the baffle reduces dissipation',
      tag: TAG,
    },
    { criterion: 'inflow', text: 'pipe or culvert outlets (also small open chutes)', tag: TAG },
  ],
  screenRow(row, ctx, d, rows) {
    const Q = { Q: dis(row.Q), limit: lim(d, 'type6MaxDischarge') };
    const v = { v: vel(row.v1), limit: lim(d, 'type6MaxVelocity') };
    const out = [
      row.Q <= d.type6MaxDischarge
        ? crit('discharge', 'pass', 'discharge-within', Q, row.Q, TAG)
        : crit('discharge', 'fail', 'discharge-above-type', Q, row.Q, TAG),
      row.v1 <= d.type6MaxVelocity
        ? crit('velocity', 'pass', 'entry-velocity-within', v, row.Q, TAG)
        : crit('velocity', 'fail', 'entry-velocity-above', v, row.Q, TAG),
    ];
    const dr = designRow(rows, ctx?.designQ) ?? row;
    const size = sizeImpactBasin({ Q: dr.Q, velocity: dr.v1 }, d);
    const tw = row.tailwaterDepth;
    out.push(
      tw === undefined || tw <= size.maxTailwaterDepth
        ? crit(
            'tailwater',
            'pass',
            'needs-no-tailwater',
            { tw: tw === undefined ? undefined : len(tw) },
            row.Q,
          )
        : crit(
            'tailwater',
            'warn',
            'baffle-overtopped',
            { tw: len(tw), max: len(size.maxTailwaterDepth) },
            row.Q,
            '[mem: HEC-14]',
          ),
    );
    return out;
  },
  screenFixed(ctx) {
    const inflow =
      ctx.inflow === 'pipe' || ctx.inflow === 'culvert'
        ? crit('inflow', 'pass', 'impact-inflow-outlet', {}, undefined, TAG)
        : ctx.inflow === 'chute' || ctx.inflow === 'known'
          ? crit('inflow', 'warn', 'impact-inflow-chute', {}, undefined, TAG)
          : crit('inflow', 'fail', 'impact-inflow-other');
    inflow.inflow = ctx.inflow;
    return [inflow, debrisCriterion(ctx, 'warn', 'pass', 'debris-under-baffle')];
  },
};
