// USBR Type I: a free hydraulic jump on a plain horizontal apron, no appurtenances.
import { jumpLengthUSBR } from '../../hydraulics';
import type { DissipatorModule } from '../types';
import { crit, debrisCriterion, jumpTailwater, noDischargeLimit, udis, vel } from './shared';
import { DISSIPATOR_NAMES } from '../names';

const TAG = '[src: USBR EM-25 via Chow 1959]';

export const usbr1: DissipatorModule = {
  id: 'usbr-1',
  name: DISSIPATOR_NAMES['usbr-1'],
  source: 'USBR EM-25 (Peterka 1958); jump length curve via Chow 1959',
  family: 'jump-basin',
  description:
    'A horizontal apron as long as the free jump; no blocks. Simple, but long at high Froude numbers.',
  limits: [
    {
      criterion: 'froude',
      text: 'any supercritical inflow (Fr1 > 1); waves for 2.5–4.5; long for Fr1 > 9',
      tag: TAG,
    },
    { criterion: 'tailwater', text: 'tailwater ≥ 1.0 × sequent depth', tag: '[src: EM-25]' },
  ],
  jump: {
    froudeRange: [1, Infinity],
    tailwaterFactor: (_fr, d) => d.tailwaterFactorType1,
    tailwaterFactorTag: '[src: EM-25] C = 1.0',
    length: (fr1, _y1, y2) => jumpLengthUSBR(fr1, y2),
    lengthTag: '[mem: USBR jump-length curve L/y2 = f(Fr1), ≈ 6·y2 for 4.5 < Fr1 < 13 [src]]',
    // A plain apron has no end sill [src: EM-25]; the shape keeps endSill, marked absent.
    appurtenances: () => ({
      endSill: { kind: 'solid', height: 0, upstreamSlope: 0, length: 0, present: false },
    }),
    freeboardRule: 'usbr',
    appurtenanceTags: [
      '[src: EM-25] plain apron: no blocks and no end sill (endSill.present false, height 0); the downstream cutoff and riprap remain',
    ],
  },
  screenRow(row, ctx, d, rows) {
    const f = row.fr1;
    const code =
      f <= 1
        ? 'plain-apron-not-supercritical'
        : f < 2.5
          ? 'plain-apron-weak-jump'
          : f < 4.5
            ? 'plain-apron-oscillating'
            : f <= 9
              ? 'plain-apron-steady'
              : 'plain-apron-strong';
    const status = f <= 1 ? 'fail' : f >= 2.5 && f < 4.5 ? 'warn' : f > 9 ? 'warn' : 'pass';
    return [
      crit('froude', status, code, { fr1: f }, row.Q, TAG),
      crit('velocity', 'pass', 'no-blocks-velocity', { v1: vel(row.v1) }, row.Q),
      crit('unitDischarge', 'pass', 'unit-discharge-no-limit', { q: udis(row.q) }, row.Q),
      noDischargeLimit(row),
      jumpTailwater(row, d.tailwaterFactorType1, d, rows, ctx),
    ];
  },
  screenFixed(ctx) {
    return [debrisCriterion(ctx, 'pass', 'pass', 'debris-plain-apron')];
  },
};
