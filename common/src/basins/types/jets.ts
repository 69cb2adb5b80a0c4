// Jets from high heads: flip bucket with plunge pool, and the submerged slotted bucket. No
// sizing here: the screening says when one is the likely answer and that a specialist study
// (and usually a physical model) is needed.
import type { CriterionResult, DischargeRow, DissipatorModule } from '../types';
import { BASIN_DEFAULTS, type BasinDefaults } from '../defaults';
import type { ScreeningContext } from '../types';
import { crit, designRow, dis, headOf, len, lim, published, vel } from './shared';
import { DISSIPATOR_NAMES } from '../names';

function energyCriteria(
  rows: readonly DischargeRow[],
  d: BasinDefaults,
  limitKey: 'specialistVelocity' | 'cavitationVelocity',
  ctx: ScreeningContext,
): CriterionResult[] {
  const dr = designRow(rows, ctx.designQ);
  if (!dr) return [crit('velocity', 'fail', 'no-discharges')];
  const h = headOf(dr);
  const v = { v1: vel(dr.v1), limit: lim(d, limitKey) };
  const head = { head: len(h), limit: len(d.specialistHead) };
  return [
    dr.v1 > d[limitKey]
      ? crit('velocity', 'pass', 'jet-velocity-high', v, dr.Q)
      : crit('velocity', 'fail', 'jet-velocity-low', v, dr.Q),
    h > d.specialistHead
      ? crit('head', 'pass', 'jet-head-high', head, dr.Q)
      : crit('head', 'fail', 'jet-head-low', head, dr.Q),
  ];
}

export const flipBucket: DissipatorModule = {
  id: 'flip-bucket',
  name: DISSIPATOR_NAMES['flip-bucket'],
  source: 'USBR EM-25 and Design of Small Dams (trajectory buckets); specialist design',
  family: 'jet',
  specialist: true,
  description:
    'Throws the jet clear of the structure into a plunge pool; for high heads where sound rock lies downstream. Not sized here.',
  limits: [
    {
      criterion: 'velocity',
      text: 'indicated when inflow velocity is too high for block basins (> ≈ {v})',
      quotes: { v: published('specialistVelocity') },
      tag: '[mem: EM-25]',
    },
    {
      criterion: 'head',
      text: 'or when the head is large (> ≈ {head})',
      quotes: { head: len(BASIN_DEFAULTS.specialistHead) },
      tag: '(common practice)',
    },
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
  name: DISSIPATOR_NAMES['slotted-bucket'],
  source: 'USBR EM-25 (Peterka 1958), Basin VII; specialist design',
  family: 'jet',
  specialist: true,
  description:
    'A submerged roller bucket for high heads where the tailwater is too deep for a jump basin. Not sized here.',
  limits: [
    {
      criterion: 'velocity',
      text: 'high-velocity inflow (> ≈ {v})',
      quotes: { v: published('cavitationVelocity') },
      tag: '[src: EM-25]',
    },
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
      ? crit('tailwater', 'fail', 'tailwater-not-known')
      : worstRatio >= d.slottedBucketTailwaterRatio
        ? crit(
            'tailwater',
            'pass',
            'bucket-tailwater-deep',
            { ratio: worstRatio },
            worst.Q,
            '[mem: EM-25]',
          )
        : crit(
            'tailwater',
            'fail',
            'bucket-tailwater-shallow',
            { ratio: worstRatio, Q: dis(worst.Q) },
            worst.Q,
            '[mem: EM-25]',
          );
    return [velocity!, head!, tw];
  },
};
