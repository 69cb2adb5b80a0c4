// SAF basin (St. Anthony Falls): chute blocks, floor blocks, end sill — a short basin for small
// structures over a wide Froude range.
import { fitBlockRow, staggeredRow } from '../blocks';
import type { BasinDefaults } from '../defaults';
import type { DissipatorModule } from '../types';
import { crit, debrisCriterion, froudeInRange, jumpTailwater, n3, noDischargeLimit } from './shared';

const TAG = '[src: Blaisdell 1948]';

/**
 * SAF tailwater factor C in TW = C·y2 [mem: Blaisdell 1948]: 1.10 − Fr²/120 for 1.7–5.5; 0.85
 * for 5.5–11; 1.00 − Fr²/800 for 11–17; held at the end values outside 1.7–17.
 */
export function safTailwaterFactor(fr1: number): number {
  const f = Math.min(17, Math.max(1.7, fr1));
  if (f <= 5.5) return 1.1 - (f * f) / 120;
  if (f <= 11) return 0.85;
  return 1.0 - (f * f) / 800;
}

/** SAF basin length L = 4.5·y2/Fr1^0.76 [mem: Blaisdell 1948]. */
export function safLength(fr1: number, y2: number, d: Pick<BasinDefaults, 'safLengthCoefficient' | 'safLengthExponent'>): number {
  return (d.safLengthCoefficient * y2) / Math.pow(fr1, d.safLengthExponent);
}

export const saf: DissipatorModule = {
  id: 'saf',
  name: 'SAF basin',
  source: 'Blaisdell 1948, St. Anthony Falls Hydraulic Laboratory (via USDA SCS and USBR)',
  family: 'jump-basin',
  description: 'Chute blocks, staggered floor blocks and a low end sill: a short basin for small spillways, canals and outlets, tailwater below the sequent depth.',
  limits: [
    { criterion: 'froude', text: 'Fr1 1.7–17', tag: TAG },
    { criterion: 'velocity', text: 'V1 above 18 m/s not advised with chute blocks', tag: TAG },
    { criterion: 'tailwater', text: 'TW = C·y2, C = 1.10 − Fr²/120 (1.7–5.5), 0.85 (5.5–11), 1.00 − Fr²/800 (11–17)', tag: '[mem: Blaisdell 1948]' },
  ],
  jump: {
    froudeRange: [1.7, 17],
    tailwaterFactor: (fr) => safTailwaterFactor(fr),
    tailwaterFactorTag: '[mem: Blaisdell 1948] C(Fr1) piecewise',
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
        chuteBlocks: { ...chute, height: y1, length: 2 * y1 },
        baffleBlocks: { ...floor, height: y1, length: b, distanceFromUpstream: d.safFloorBlockPosition * length, kind: 'floor-blocks' },
        endSill: { kind: 'solid', height: sill, upstreamSlope: 1, length: sill },
      };
    },
    freeboardRule: 'saf',
    appurtenanceTags: [
      '[mem: Blaisdell 1948] chute blocks h = y1, width = spacing = 0.75·y1',
      '[mem: Blaisdell 1948] floor blocks h = y1, width = spacing = 0.75·y1, staggered, upstream face at L/3',
      '[mem: Blaisdell 1948] end sill 0.07·y2; wall top y2/3 above the largest tailwater; wingwalls at 45°',
    ],
  },
  screenRow(row, _ctx, d, rows) {
    const v = row.v1;
    const velocity =
      v <= d.cavitationVelocity
        ? crit('velocity', 'pass', `V1 ${n3(v)} m/s ≤ ${n3(d.cavitationVelocity)} m/s`, row.Q)
        : v <= d.safVelocityFail
          ? crit('velocity', 'warn', `V1 ${n3(v)} m/s > ${n3(d.cavitationVelocity)} m/s: cavitation risk on the chute blocks, model study`, row.Q)
          : crit('velocity', 'fail', `V1 ${n3(v)} m/s > ${n3(d.safVelocityFail)} m/s: chute blocks not advised ${TAG}`, row.Q);
    return [
      froudeInRange(row, 1.7, 17, TAG),
      velocity,
      crit('unitDischarge', 'pass', `q ${n3(row.q)} m²/s: no published limit (the type is meant for small structures)`, row.Q),
      noDischargeLimit(row),
      jumpTailwater(row, safTailwaterFactor(row.fr1), d, rows),
    ];
  },
  screenFixed(ctx) {
    return [debrisCriterion(ctx, 'warn', 'pass', 'the blocks catch large debris')];
  },
};
