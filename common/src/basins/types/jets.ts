// Jets from high heads: flip bucket with plunge pool, and the submerged slotted bucket. No
// sizing here: the screening says when one is the likely answer and that a specialist study
// (and usually a physical model) is needed.
import type { CriterionResult, DischargeRow, DissipatorModule } from '../types';
import { limitText, type BasinDefaults } from '../defaults';
import type { ScreeningContext } from '../types';
import { crit, designRow, headOf, n3, ph } from './shared';

function energyCriteria(
  rows: readonly DischargeRow[],
  d: BasinDefaults,
  limitKey: 'specialistVelocity' | 'cavitationVelocity',
  ctx: ScreeningContext,
): CriterionResult[] {
  const P = ph(ctx);
  const dr = designRow(rows, ctx.designQ);
  if (!dr) return [crit('velocity', 'fail', 'no discharges to screen')];
  const h = headOf(dr);
  const velocityLimit = d[limitKey];
  return [
    dr.v1 > velocityLimit
      ? crit(
          'velocity',
          'pass',
          `V1 ${P.vel(dr.v1)} at the largest discharge is beyond ${limitText(P, d, limitKey)}, where basins with blocks become doubtful`,
          dr.Q,
        )
      : crit(
          'velocity',
          'fail',
          `V1 ${P.vel(dr.v1)} ≤ ${limitText(P, d, limitKey)}: a stilling basin can serve`,
          dr.Q,
        ),
    h > d.specialistHead
      ? crit(
          'head',
          'pass',
          `head ${P.len(h)} above the floor exceeds ${P.len(d.specialistHead)} (common practice)`,
          dr.Q,
        )
      : crit(
          'head',
          'fail',
          `head ${P.len(h)} ≤ ${P.len(d.specialistHead)} (common practice)`,
          dr.Q,
        ),
  ];
}

export const flipBucket: DissipatorModule = {
  id: 'flip-bucket',
  name: 'Flip bucket with plunge pool',
  source: 'USBR EM-25 and Design of Small Dams (trajectory buckets); specialist design',
  family: 'jet',
  specialist: true,
  description:
    'Throws the jet clear of the structure into a plunge pool; for high heads where sound rock lies downstream. Not sized here.',
  limits: [
    {
      criterion: 'velocity',
      text: 'indicated when inflow velocity is too high for block basins (> ≈ 18 m/s)',
      tag: '[mem: EM-25]',
    },
    { criterion: 'head', text: 'or when the head is large (> ≈ 50 m)', tag: '(common practice)' },
  ],
  screenRow: () => [],
  indicated: (c) =>
    c.some((x) => (x.criterion === 'velocity' || x.criterion === 'head') && x.status === 'pass'),
  screenFixed(ctx, d, rows) {
    return energyCriteria(rows, d, 'specialistVelocity', ctx);
  },
};

export const slottedBucket: DissipatorModule = {
  id: 'slotted-bucket',
  name: 'Slotted (submerged) bucket',
  source: 'USBR EM-25 (Peterka 1958), Basin VII; specialist design',
  family: 'jet',
  specialist: true,
  description:
    'A submerged roller bucket for high heads where the tailwater is too deep for a jump basin. Not sized here.',
  limits: [
    { criterion: 'velocity', text: 'high-velocity inflow (> ≈ 15 m/s)', tag: '[src: EM-25]' },
    {
      criterion: 'tailwater',
      text: 'tailwater deeper than the sequent depth at bed level (≥ ≈ 1.1·y2)',
      tag: '[mem: EM-25]',
    },
  ],
  screenRow: () => [],
  indicated: (c) =>
    c.some((x) => (x.criterion === 'velocity' || x.criterion === 'head') && x.status === 'pass') &&
    c.some((x) => x.criterion === 'tailwater' && x.status === 'pass'),
  screenFixed(ctx, d, rows) {
    const P = ph(ctx);
    const [velocity, head] = energyCriteria(rows, d, 'cavitationVelocity', ctx);
    let worst: DischargeRow | undefined;
    let worstRatio = Infinity;
    for (const r of rows) {
      if (r.tailwaterDepth === undefined) continue;
      const ratio = r.tailwaterDepth / r.y2;
      if (ratio < worstRatio) {
        worstRatio = ratio;
        worst = r;
      }
    }
    const tw = !worst
      ? crit('tailwater', 'fail', 'tailwater not known')
      : worstRatio >= d.slottedBucketTailwaterRatio
        ? crit(
            'tailwater',
            'pass',
            `tailwater at bed level is ≥ ${n3(worstRatio)}× the sequent depth at every discharge: deep tailwater suits a submerged bucket [mem: EM-25]`,
            worst.Q,
          )
        : crit(
            'tailwater',
            'fail',
            `tailwater at bed level is only ${n3(worstRatio)}× the sequent depth at ${P.Q(worst.Q)}: a submerged bucket needs deeper tailwater [mem: EM-25]`,
            worst.Q,
          );
    return [velocity!, head!, tw];
  },
};
