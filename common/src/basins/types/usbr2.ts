// USBR Type II: chute blocks and a dentated end sill, no baffle piers (high velocities).
import { fitBlockRow } from '../blocks';
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

export const usbr2: DissipatorModule = {
  id: 'usbr-2',
  name: DISSIPATOR_NAMES['usbr-2'],
  source: 'USBR EM-25 (Peterka 1958); Design of Small Dams',
  family: 'jump-basin',
  description:
    'Chute blocks and a dentated end sill, no baffle piers: for inflow velocities too high for piers (high dams, large chutes).',
  limits: [
    { criterion: 'froude', text: 'Fr1 ≥ 4.5', tag: TAG },
    {
      criterion: 'unitDischarge',
      text: 'tested to q ≈ {q}',
      quotes: { q: published('type2MaxUnitDischarge') },
      tag: '[mem: EM-25]',
    },
    {
      criterion: 'tailwater',
      text: 'tailwater ≥ 1.05 × sequent depth (safety margin)',
      tag: '[mem: EM-25]',
    },
  ],
  jump: {
    froudeRange: [4.5, Infinity],
    tailwaterFactor: (_fr, d) => d.tailwaterFactorType2,
    tailwaterFactorTag: '[mem: EM-25] C = 1.05',
    length: (fr1, _y1, y2, d) =>
      interpolate(
        [
          [4.5, d.type2LengthRatioAtFr4_5],
          [14, d.type2LengthRatioAtFr14],
        ],
        fr1,
      ) * y2,
    lengthTag: '[mem: EM-25] L ≈ 4.0·y2 at Fr1 4.5 rising to 4.4·y2 at Fr1 ≥ 14',
    appurtenances: ({ y1, y2, width, d }) => {
      // [mem: EM-25] chute blocks h = w = s = y1, half space at walls; dentated sill h = 0.2·y2,
      // teeth and gaps 0.15·y2, upstream slope 2:1.
      const row = fitBlockRow(width, y1, y1);
      const sillH = d.type2SillHeightRatio * y2;
      const teeth = fitBlockRow(width, d.type2ToothRatio * y2, d.type2ToothRatio * y2);
      return {
        chuteBlocks: { ...row, height: y1, length: d.chuteBlockLengthRatio * y1 },
        endSill: {
          kind: 'dentated',
          present: true,
          height: sillH,
          upstreamSlope: 2,
          length: 2 * sillH + 0.02 * y2,
          teeth: {
            count: teeth.count,
            width: teeth.width,
            spacing: teeth.spacing,
            wallSpace: teeth.wallSpace,
            centres: teeth.centres,
            ...(teeth.narrow ? { narrow: true } : {}),
          },
        },
      };
    },
    freeboardRule: 'usbr',
    appurtenanceTags: [
      '[mem: EM-25] chute blocks h = w = s = y1, half spaces at the walls',
      '[mem: EM-25] dentated end sill h = 0.2·y2, teeth and gaps 0.15·y2, 2:1 upstream slope; no baffle piers [src]',
    ],
  },
  screenRow(row, ctx, d, rows) {
    const q = { q: udis(row.q), limit: lim(d, 'type2MaxUnitDischarge') };
    return [
      froudeInRange(row, 4.5, Infinity, TAG),
      crit('velocity', 'pass', 'no-piers-velocity', { v1: vel(row.v1) }, row.Q),
      row.q <= d.type2MaxUnitDischarge
        ? crit('unitDischarge', 'pass', 'unit-discharge-within-tested', q, row.Q, '[mem: EM-25]')
        : crit('unitDischarge', 'warn', 'unit-discharge-above-tested', q, row.Q, '[mem: EM-25]'),
      noDischargeLimit(row),
      jumpTailwater(row, d.tailwaterFactorType2, d, rows, ctx),
    ];
  },
  screenFixed(ctx) {
    return [debrisCriterion(ctx, 'warn', 'pass', 'debris-blocks-teeth')];
  },
};
