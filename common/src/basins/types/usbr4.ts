// USBR Type IV: deflector blocks for the oscillating jump range.
import { jumpLengthUSBR } from '../../hydraulics';
import { fitBlockRow } from '../blocks';
import type { DissipatorModule } from '../types';
import {
  crit,
  debrisCriterion,
  froudeInRange,
  jumpTailwater,
  noDischargeLimit,
  lim,
  udis,
  vel,
} from './shared';
import { DISSIPATOR_NAMES } from '../names';

const TAG = '[src: USBR EM-25]';

export const usbr4: DissipatorModule = {
  id: 'usbr-4',
  name: DISSIPATOR_NAMES['usbr-4'],
  source: 'USBR EM-25 (Peterka 1958)',
  family: 'jump-basin',
  description:
    'Large deflector blocks that break up the oscillating jump (Fr1 2.5–4.5); for small unit discharges, with wave suppressors if waves persist.',
  limits: [
    { criterion: 'froude', text: 'Fr1 2.5–4.5', tag: TAG },
    {
      criterion: 'unitDischarge',
      text: 'small unit discharges (canal and diversion structures)',
      tag: TAG,
    },
    { criterion: 'tailwater', text: 'tailwater ≈ 1.1 × sequent depth', tag: '[mem: EM-25]' },
  ],
  jump: {
    froudeRange: [2.5, 4.5],
    tailwaterFactor: (_fr, d) => d.tailwaterFactorType4,
    tailwaterFactorTag: '[mem: EM-25] C = 1.1',
    length: (fr1, _y1, y2) => jumpLengthUSBR(fr1, y2),
    lengthTag: '[mem: EM-25] L ≈ length of the free jump (USBR curve)',
    appurtenances: ({ y1, width, d }) => {
      // [mem: EM-25] deflector blocks h = 2·y1, width ≤ y1 (y1 used), spaces 2.5 × width.
      const row = fitBlockRow(width, y1, d.type4DeflectorSpacingRatio * y1);
      const sill = d.type4SillHeightRatio * y1;
      const h = d.type4DeflectorHeightRatio * y1;
      return {
        chuteBlocks: { ...row, height: h, length: d.chuteBlockLengthRatio * h },
        endSill: {
          kind: 'solid',
          height: sill,
          upstreamSlope: 2,
          length: 2 * sill,
          present: sill > 0,
        },
      };
    },
    freeboardRule: 'usbr',
    appurtenanceTags: [
      '[mem: EM-25] deflector blocks h = 2·y1, width y1 (at most), spaces 2.5 × width',
      '[mem: EM-25] optional solid end sill, height 1.25·y1 (default, overridable)',
    ],
  },
  screenRow(row, ctx, d, rows) {
    const v = { v1: vel(row.v1), limit: lim(d, 'cavitationVelocity') };
    return [
      froudeInRange(row, 2.5, 4.5, TAG),
      row.v1 <= d.cavitationVelocity
        ? crit('velocity', 'pass', 'velocity-within', v, row.Q)
        : crit('velocity', 'warn', 'deflectors-cavitation-risk', v, row.Q, '[src: EM-25]'),
      crit('unitDischarge', 'pass', 'unit-discharge-small', { q: udis(row.q) }, row.Q),
      noDischargeLimit(row),
      jumpTailwater(row, d.tailwaterFactorType4, d, rows, ctx),
    ];
  },
  screenFixed(ctx) {
    return [debrisCriterion(ctx, 'warn', 'pass', 'debris-deflectors')];
  },
};
