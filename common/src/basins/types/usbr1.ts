// USBR Type I: a free hydraulic jump on a plain horizontal apron, no appurtenances.
import { jumpLengthUSBR } from '../../hydraulics';
import type { DissipatorModule } from '../types';
import { crit, debrisCriterion, jumpTailwater, n3, noDischargeLimit, ph } from './shared';

const TAG = '[src: USBR EM-25 via Chow 1959]';

export const usbr1: DissipatorModule = {
  id: 'usbr-1',
  name: 'USBR Type I basin (free jump on a plain apron)',
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
    const P = ph(ctx);
    const f = row.fr1;
    let froude;
    if (f <= 1)
      froude = crit(
        'froude',
        'fail',
        `Fr1 ${n3(f)} ≤ 1: the inflow is not supercritical, no jump forms ${TAG}`,
        row.Q,
      );
    else if (f < 2.5)
      froude = crit(
        'froude',
        'pass',
        `Fr1 ${n3(f)}: ${f < 1.7 ? 'undular' : 'weak'} jump, little energy to lose; a plain apron serves ${TAG}`,
        row.Q,
      );
    else if (f < 4.5)
      froude = crit(
        'froude',
        'warn',
        `Fr1 ${n3(f)} in 2.5–4.5: oscillating jump, waves travel downstream (a Type IV basin or wave suppressors) ${TAG}`,
        row.Q,
      );
    else if (f <= 9) froude = crit('froude', 'pass', `Fr1 ${n3(f)}: steady jump ${TAG}`, row.Q);
    else
      froude = crit(
        'froude',
        'warn',
        `Fr1 ${n3(f)} > 9: strong jump; the plain apron is long (≈ 6·y2); a basin with blocks is shorter ${TAG}`,
        row.Q,
      );
    return [
      froude,
      crit('velocity', 'pass', `no blocks to cavitate (V1 ${P.vel(row.v1)})`, row.Q),
      crit(
        'unitDischarge',
        'pass',
        `no published limit on unit discharge (q ${P.q(row.q)})`,
        row.Q,
      ),
      noDischargeLimit(row, ctx),
      jumpTailwater(row, d.tailwaterFactorType1, d, rows, ctx),
    ];
  },
  screenFixed(ctx) {
    return [debrisCriterion(ctx, 'pass', 'pass', 'a plain apron has nothing to catch it')];
  },
};
