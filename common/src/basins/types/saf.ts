// SAF basin (St. Anthony Falls): chute blocks, floor blocks, end sill — a short basin for small
// structures over a wide Froude range.
import { InputError } from '../../errors';
import { fitBlockRow, staggeredRow } from '../blocks';
import type { BasinDefaults } from '../defaults';
import type { DissipatorModule } from '../types';
import { BASIN_DEFAULTS } from '../defaults';
import {
  crit,
  debrisCriterion,
  froudeInRange,
  jumpTailwater,
  noDischargeLimit,
  lim,
  published,
  udis,
  vel,
} from './shared';
import { DISSIPATOR_NAMES } from '../names';

const TAG = '[src: Blaisdell 1948]';

type SafFactorDefaults = Pick<
  BasinDefaults,
  | 'safTailwaterLowIntercept'
  | 'safTailwaterLowDivisor'
  | 'safTailwaterMid'
  | 'safTailwaterHighIntercept'
  | 'safTailwaterHighDivisor'
>;

/**
 * SAF tailwater factor C in TW = C·y2 [mem: Blaisdell 1948, every coefficient an overridable
 * default]: 1.10 − Fr²/120 (Fr1 1.7–5.5), 0.85 (5.5–11), 1.00 − Fr²/800 (11–17).
 * The published breaks 5.5 and 11 are rounded: the pieces meet 0.85 at Fr1 = √30 ≈ 5.477 and
 * √120 ≈ 10.954, and the breaks are taken there so C is continuous (the rounded breaks leave
 * steps of 0.002 and 0.001). Outside 1.7–17 C is held at the end value (at 17: 0.639), never
 * extrapolated — 1 − Fr²/800 would fall to zero at Fr1 28 — and the sizing flags the Froude
 * number as outside the tested range.
 * @example safTailwaterFactor(8) // 0.85
 */
export function safTailwaterFactor(fr1: number, d: SafFactorDefaults = BASIN_DEFAULTS): number {
  if (!Number.isFinite(fr1))
    throw new InputError(
      'fr1',
      'not-finite',
      `fr1 (inflow Froude number) must be a finite number (got ${fr1})`,
      {},
    );
  const f = Math.min(17, Math.max(1.7, fr1));
  const mid = d.safTailwaterMid;
  // Where each curve meets the middle value (continuity), kept in order within 1.7–17.
  const b1 = Math.min(
    17,
    Math.max(
      1.7,
      Math.sqrt(Math.max(0, (d.safTailwaterLowIntercept - mid) * d.safTailwaterLowDivisor)),
    ),
  );
  if (f <= b1) return d.safTailwaterLowIntercept - (f * f) / d.safTailwaterLowDivisor;
  const b2 = Math.min(
    17,
    Math.max(
      b1,
      Math.sqrt(Math.max(0, (d.safTailwaterHighIntercept - mid) * d.safTailwaterHighDivisor)),
    ),
  );
  if (f <= b2) return mid;
  return d.safTailwaterHighIntercept - (f * f) / d.safTailwaterHighDivisor;
}

/** SAF basin length L = 4.5·y2/Fr1^0.76 [mem: Blaisdell 1948]. */
export function safLength(
  fr1: number,
  y2: number,
  d: Pick<BasinDefaults, 'safLengthCoefficient' | 'safLengthExponent'>,
): number {
  return (d.safLengthCoefficient * y2) / Math.pow(fr1, d.safLengthExponent);
}

export const saf: DissipatorModule = {
  id: 'saf',
  name: DISSIPATOR_NAMES.saf,
  source: 'Blaisdell 1948, St. Anthony Falls Hydraulic Laboratory (via USDA SCS and USBR)',
  family: 'jump-basin',
  description:
    'Chute blocks, staggered floor blocks and a low end sill: a short basin for small spillways, canals and outlets, tailwater below the sequent depth.',
  limits: [
    { criterion: 'froude', text: 'Fr1 1.7–17', tag: TAG },
    {
      criterion: 'velocity',
      text: 'V1 above {v} not advised with chute blocks',
      quotes: { v: published('safVelocityFail') },
      tag: TAG,
    },
    {
      criterion: 'tailwater',
      text: 'TW = C·y2, C = 1.10 − Fr²/120 (1.7–5.5), 0.85 (5.5–11), 1.00 − Fr²/800 (11–17)',
      tag: '[mem: Blaisdell 1948]',
    },
  ],
  jump: {
    froudeRange: [1.7, 17],
    tailwaterFactor: (fr, d) => safTailwaterFactor(fr, d),
    tailwaterFactorTag:
      '[mem: Blaisdell 1948] C = 1.10 − Fr²/120, 0.85, 1.00 − Fr²/800, pieces joined where they meet (continuous), held outside Fr1 1.7–17',
    length: (fr1, _y1, y2, d) => safLength(fr1, y2, d),
    lengthTag: '[mem: Blaisdell 1948] L = 4.5·y2/Fr1^0.76',
    appurtenances: ({ y1, y2, width, length, d }) => {
      // [mem: Blaisdell 1948] chute and floor blocks h = y1, width = spacing = 0.75·y1; floor
      // blocks staggered behind the openings, upstream face at L/3; end sill 0.07·y2.
      const b = d.safBlockRatio * y1;
      const chute = fitBlockRow(width, b, b);
      const floor = staggeredRow(width, chute, b);
      const sill = d.safSillRatio * y2;
      return {
        chuteBlocks: { ...chute, height: y1, length: d.chuteBlockLengthRatio * y1 },
        baffleBlocks: {
          ...floor,
          height: y1,
          length: b,
          distanceFromUpstream: d.safFloorBlockPosition * length,
          kind: 'floor-blocks',
        },
        endSill: { kind: 'solid', height: sill, upstreamSlope: 1, length: sill, present: true },
      };
    },
    freeboardRule: 'saf',
    appurtenanceTags: [
      '[mem: Blaisdell 1948] chute blocks h = y1, width = spacing = 0.75·y1',
      '[mem: Blaisdell 1948] floor blocks h = y1, width = spacing = 0.75·y1, staggered, upstream face at L/3',
      '[mem: Blaisdell 1948] end sill 0.07·y2; wall top y2/3 above the largest tailwater; wingwalls at 45°',
    ],
  },
  screenRow(row, ctx, d, rows) {
    const v = row.v1;
    const velocity =
      v <= d.cavitationVelocity
        ? crit(
            'velocity',
            'pass',
            'velocity-within',
            { v1: vel(v), limit: lim(d, 'cavitationVelocity') },
            row.Q,
          )
        : v <= d.safVelocityFail
          ? crit(
              'velocity',
              'warn',
              'chute-blocks-cavitation-risk',
              { v1: vel(v), limit: lim(d, 'cavitationVelocity') },
              row.Q,
            )
          : crit(
              'velocity',
              'fail',
              'chute-blocks-not-advised',
              { v1: vel(v), limit: lim(d, 'safVelocityFail') },
              row.Q,
              TAG,
            );
    return [
      froudeInRange(row, 1.7, 17, TAG),
      velocity,
      crit('unitDischarge', 'pass', 'unit-discharge-small-structures', { q: udis(row.q) }, row.Q),
      noDischargeLimit(row),
      jumpTailwater(row, safTailwaterFactor(row.fr1, d), d, rows, ctx),
    ];
  },
  screenFixed(ctx) {
    return [debrisCriterion(ctx, 'warn', 'pass', 'debris-saf-blocks')];
  },
};
