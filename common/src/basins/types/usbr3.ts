// USBR Type III: chute blocks, baffle piers and a solid end sill — a short basin for moderate
// velocities.
import { fitBlockRow, staggerBehind } from '../blocks';
import { interpolate } from '../guards';
import type { DissipatorModule } from '../types';
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

const TAG = '[src: USBR EM-25]';

/** Baffle pier height h3 = y1·(0.168·Fr1 + 0.63) [mem: USBR EM-25, Type III]. */
export function type3BaffleHeight(y1: number, fr1: number): number {
  return y1 * (0.168 * fr1 + 0.63);
}

/** Solid end sill height h4 = y1·(0.0556·Fr1 + 1.0) [mem: USBR EM-25, Type III]. */
export function type3SillHeight(y1: number, fr1: number): number {
  return y1 * (0.0556 * fr1 + 1.0);
}

export const usbr3: DissipatorModule = {
  id: 'usbr-3',
  name: DISSIPATOR_NAMES['usbr-3'],
  source: 'USBR EM-25 (Peterka 1958); Design of Small Dams',
  family: 'jump-basin',
  description:
    'Chute blocks, baffle piers and a solid end sill: the shortest USBR jump basin, for moderate inflow velocity and no heavy debris.',
  limits: [
    { criterion: 'froude', text: 'Fr1 4.5–17', tag: TAG },
    {
      criterion: 'velocity',
      text: 'V1 ≤ {warn}; {warn} to {fail} with care; above {fail} baffle piers cavitate',
      quotes: { warn: published('type3VelocityWarn'), fail: published('type3VelocityFail') },
      tag: '[src/mem: EM-25]',
    },
    {
      criterion: 'unitDischarge',
      text: 'q ≤ ≈ {q}',
      quotes: { q: published('type3MaxUnitDischarge') },
      tag: '[mem: EM-25]',
    },
    { criterion: 'debris', text: 'no heavy debris (piers catch it)', tag: TAG },
  ],
  jump: {
    froudeRange: [4.5, 17],
    tailwaterFactor: (_fr, d) => d.tailwaterFactorType3,
    tailwaterFactorTag: '[mem: EM-25] C = 1.0',
    length: (fr1, _y1, y2, d) =>
      interpolate(
        [
          [4.5, d.type3LengthRatioAtFr4_5],
          [10, d.type3LengthRatioAtFr10],
        ],
        fr1,
      ) * y2,
    lengthTag: '[mem: EM-25] L ≈ 2.3·y2 at Fr1 4.5 rising to 2.8·y2 at Fr1 ≥ 10',
    appurtenances: ({ fr1, y1, y2, width, d }) => {
      const chute = fitBlockRow(width, y1, y1);
      const h3 = type3BaffleHeight(y1, fr1);
      // staggered with the chute blocks: behind their openings where the two pitches allow
      const piers = staggerBehind(width, chute, 0.75 * h3, 0.75 * h3);
      const h4 = type3SillHeight(y1, fr1);
      return {
        chuteBlocks: { ...chute, height: y1, length: d.chuteBlockLengthRatio * y1 },
        baffleBlocks: {
          ...piers,
          height: h3,
          // top 0.2·h3 and a 1:1 downstream face [mem: EM-25]
          topLength: 0.2 * h3,
          length: 1.2 * h3,
          distanceFromUpstream: d.type3PierDistanceRatio * y2,
          kind: 'baffle-piers',
        },
        endSill: { kind: 'solid', height: h4, upstreamSlope: 2, length: 2 * h4, present: true },
      };
    },
    freeboardRule: 'usbr',
    appurtenanceTags: [
      '[mem: EM-25] chute blocks h = w = s = y1',
      '[mem: EM-25] baffle piers h3 = y1·(0.168·Fr1 + 0.63), width and spacing 0.75·h3, top 0.2·h3, upstream face 0.8·y2 from the chute blocks, staggered with the chute blocks',
      '[mem: EM-25] solid end sill h4 = y1·(0.0556·Fr1 + 1.0), 2:1 upstream slope',
    ],
  },
  screenRow(row, ctx, d, rows) {
    const v = row.v1;
    const velocity =
      v <= d.type3VelocityWarn
        ? crit(
            'velocity',
            'pass',
            'velocity-within',
            { v1: vel(v), limit: lim(d, 'type3VelocityWarn') },
            row.Q,
            TAG,
          )
        : v <= d.type3VelocityFail
          ? crit(
              'velocity',
              'warn',
              'piers-cavitation-risk',
              { v1: vel(v), limit: lim(d, 'type3VelocityWarn') },
              row.Q,
              '[src: EM-25]',
            )
          : crit(
              'velocity',
              'fail',
              'piers-would-cavitate',
              { v1: vel(v), limit: lim(d, 'type3VelocityFail') },
              row.Q,
              '[mem: EM-25]',
            );
    const q = { q: udis(row.q), limit: lim(d, 'type3MaxUnitDischarge') };
    return [
      froudeInRange(row, 4.5, 17, TAG),
      velocity,
      row.q <= d.type3MaxUnitDischarge
        ? crit('unitDischarge', 'pass', 'unit-discharge-within', q, row.Q, '[mem: EM-25]')
        : crit('unitDischarge', 'fail', 'unit-discharge-above-tests', q, row.Q, '[mem: EM-25]'),
      noDischargeLimit(row),
      jumpTailwater(row, d.tailwaterFactorType3, d, rows, ctx),
    ];
  },
  screenFixed(ctx) {
    return [debrisCriterion(ctx, 'fail', 'warn', 'debris-piers')];
  },
};
