// USBR Type VI impact basin: a box with a hanging baffle at a pipe outlet; needs no tailwater.
import { G } from '../../units/constants';
import { BASIN_DEFAULTS, limitPair, limitText, type BasinDefaults } from '../defaults';
import { reqNonNegative, reqPositive, roundUp } from '../guards';
import type { DissipatorModule } from '../types';
import { phraser, type PhraseUnits } from '../../units/phrase';
import { crit, debrisCriterion, designRow, ph } from './shared';

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
  warnings: string[];
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
  units: PhraseUnits = 'SI',
): ImpactBasinSizing {
  const P = phraser(units);
  const Q = reqPositive('Q (discharge)', c.Q);
  const V = reqPositive('velocity (entering velocity)', c.velocity);
  const A = Q / V;
  const ye = Math.sqrt(A / 2);
  const fr = V / Math.sqrt(G * ye);
  const curveWidth = ye * d.type6WidthCoefficient * Math.pow(fr, d.type6WidthExponent);
  const W = c.width !== undefined ? reqPositive('width', c.width) : roundUp(curveWidth, 0.05);
  const warnings: string[] = [
    'the Type VI width comes from a fit of the HEC-14 design curve recalled from memory: check W against the published curve',
  ];
  if (W < curveWidth * 0.999)
    warnings.push(`Width ${P.len(W)} is narrower than the ${P.len(curveWidth)} of the width curve`);
  if (Q > d.type6MaxDischarge)
    warnings.push(
      `Q ${P.Q(Q)} exceeds the ${limitText(P, d, 'type6MaxDischarge')} limit of the type ${TAG}`,
    );
  if (V > d.type6MaxVelocity)
    warnings.push(
      `Entering velocity ${P.vel(V)} exceeds ${limitText(P, d, 'type6MaxVelocity')} ${TAG}`,
    );
  const baffleHeight = 0.375 * W;
  const baffleClearance = W / 6;
  const maxTw = baffleClearance + baffleHeight / 2;
  if (
    c.tailwaterDepth !== undefined &&
    reqNonNegative('tailwaterDepth', c.tailwaterDepth) > maxTw
  ) {
    warnings.push(
      `Tailwater ${P.len(c.tailwaterDepth)} above the floor exceeds ${P.len(maxTw)} (h3 + h2/2): flow overtops the baffle, dissipation falls [mem: HEC-14]`,
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
  name: 'USBR Type VI impact basin',
  source: 'USBR (Beichley 1957, ASCE); FHWA HEC-14 (2006) §9.4',
  family: 'impact-basin',
  description:
    'A compact box with a hanging baffle at a pipe or small chute outlet; works without tailwater.',
  limits: [
    { criterion: 'discharge', text: 'Q up to 11 m³/s', tag: TAG },
    { criterion: 'velocity', text: 'entering velocity up to 15 m/s', tag: TAG },
    {
      criterion: 'tailwater',
      text: 'needs no tailwater; tailwater above the baffle reduces dissipation',
      tag: TAG,
    },
    { criterion: 'inflow', text: 'pipe or culvert outlets (also small open chutes)', tag: TAG },
  ],
  screenRow(row, ctx, d, rows) {
    const P = ph(ctx);
    const out = [
      row.Q <= d.type6MaxDischarge
        ? crit(
            'discharge',
            'pass',
            `Q ${P.Q(row.Q)} ≤ ${limitText(P, d, 'type6MaxDischarge')} ${TAG}`,
            row.Q,
          )
        : crit(
            'discharge',
            'fail',
            `Q ${limitPair(P, row.Q, d, 'type6MaxDischarge')[0]} exceeds the ${limitText(P, d, 'type6MaxDischarge')} of the type ${TAG}`,
            row.Q,
          ),
      row.v1 <= d.type6MaxVelocity
        ? crit(
            'velocity',
            'pass',
            `V ${P.vel(row.v1)} ≤ ${limitText(P, d, 'type6MaxVelocity')} ${TAG}`,
            row.Q,
          )
        : crit(
            'velocity',
            'fail',
            `V ${limitPair(P, row.v1, d, 'type6MaxVelocity')[0]} exceeds ${limitText(P, d, 'type6MaxVelocity')} ${TAG}`,
            row.Q,
          ),
    ];
    const dr = designRow(rows, ctx?.designQ) ?? row;
    const size = sizeImpactBasin({ Q: dr.Q, velocity: dr.v1 }, d);
    const tw = row.tailwaterDepth;
    out.push(
      tw === undefined || tw <= size.maxTailwaterDepth
        ? crit(
            'tailwater',
            'pass',
            'needs no tailwater' +
              (tw === undefined ? '' : ` (tailwater ${P.len(tw)} stays below the baffle)`),
            row.Q,
          )
        : crit(
            'tailwater',
            'warn',
            `tailwater ${P.len(tw)} overtops the baffle zone (> ${P.len(size.maxTailwaterDepth)}): less dissipation [mem: HEC-14]`,
            row.Q,
          ),
    );
    return out;
  },
  screenFixed(ctx) {
    const inflow =
      ctx.inflow === 'pipe' || ctx.inflow === 'culvert'
        ? crit('inflow', 'pass', `a ${ctx.inflow} outlet: the type was developed for it ${TAG}`)
        : ctx.inflow === 'chute' || ctx.inflow === 'known'
          ? crit(
              'inflow',
              'warn',
              'developed for pipe outlets; usable with a small open chute ' + TAG,
            )
          : crit(
              'inflow',
              'fail',
              `a ${ctx.inflow} inflow: the type needs a pipe, culvert or small chute entering the box`,
            );
    return [
      inflow,
      debrisCriterion(
        ctx,
        'warn',
        'pass',
        'debris can clog the space under the baffle (the flow then passes over it)',
      ),
    ];
  },
};
