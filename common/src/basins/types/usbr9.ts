// USBR Type IX baffled apron (baffled chute drop): rows of baffles on a 2:1 slope; no tailwater.
import { InputError } from '../../errors';
import { G } from '../../units/constants';
import { fitBlockRow, staggeredRow, type BlockRow } from '../blocks';
import { BASIN_DEFAULTS, type BasinDefaults } from '../defaults';
import { reqPositive } from '../guards';
import type { DissipatorModule } from '../types';
import { warn, type StudyWarning } from '../../warnings';
import { ENGINE_LIMITS } from '../../schemas/limits';
import { crit, debrisCriterion, lim, published, udis } from './shared';
import { DISSIPATOR_NAMES } from '../names';

const TAG = '[src: USBR, Design of Small Dams / EM-25 Basin IX]';

export interface BaffledApronSizing {
  type: 'usbr-9';
  width: number;
  q: number;
  /** critical depth at the crest, m */
  criticalDepth: number;
  /** critical velocity (g·q)^(1/3), the upper bound of a "near critical" entry, m/s [calc] */
  criticalVelocity: number;
  baffleHeight: number;
  baffleWidth: number;
  /** distance between rows along the slope, m */
  rowSpacing: number;
  rows: number;
  /** horizontal per 1 vertical */
  slope: number;
  /** length of the sloping apron, along the slope, m */
  slopeLength: number;
  /** horizontal length, m */
  length: number;
  /** wall height normal to the slope, m */
  wallHeight: number;
  /** full rows and the staggered rows between them */
  rowA: BlockRow;
  rowB: BlockRow;
  warnings: StudyWarning[];
  sources: string[];
}

/**
 * Sizes a Type IX baffled apron [mem: Design of Small Dams, Basin IX; q limit src]: yc =
 * (q²/g)^(1/3); baffle height 0.8·yc; baffle width and space 1.5·h; rows 2·h apart along a 2:1
 * slope; walls 3·h high normal to the slope; at least 4 rows, with the lowest row buried
 * below the channel bed.
 * @example sizeBaffledApron({ Q: 20, width: 5, drop: 3 }).rows
 */
export function sizeBaffledApron(
  c: { Q: number; width: number; drop: number },
  d: BasinDefaults = { ...BASIN_DEFAULTS },
): BaffledApronSizing {
  const Q = reqPositive('Q', c.Q);
  const W = reqPositive('width', c.width);
  const drop = reqPositive('drop (crest to channel bed)', c.drop);
  const q = Q / W;
  const yc = Math.cbrt((q * q) / G);
  const h = d.type9BaffleHeightRatio * yc;
  const bw = d.type9BaffleWidthRatio * h;
  const spacing = d.type9RowSpacingRatio * h;
  const slope = d.type9ChuteSlope;
  const above = drop * Math.sqrt(1 + slope * slope);
  // One row buried below the bed keeps the bed from scouring under the last row [mem: DSD].
  const rows = Math.max(d.type9MinRows, Math.ceil(above / spacing) + 2);
  if (rows > ENGINE_LIMITS.maxBlockRows)
    throw new InputError(
      'drop',
      'too-many-rows',
      `drop (crest to channel bed): ${rows} rows of baffle piers ${h.toPrecision(3)} m high would be needed, more than the ${ENGINE_LIMITS.maxBlockRows} one apron may hold; the unit discharge is too small for the drop`,
      { rows, max: ENGINE_LIMITS.maxBlockRows },
    );
  const slopeLength = (rows - 1) * spacing + spacing / 2;
  const warnings: StudyWarning[] = [];
  if (q > d.type9MaxUnitDischarge)
    warnings.push(
      warn(
        'type9-unit-discharge',
        { q: udis(q), limit: lim(d, 'type9MaxUnitDischarge') },
        { type: 'usbr-9' },
      ),
    );
  const rowA = fitBlockRow(W, Math.min(bw, W), bw);
  const rowB = staggeredRow(W, rowA, Math.min(bw, W));
  const blocks = Math.ceil(rows / 2) * rowA.count + Math.floor(rows / 2) * rowB.count;
  if (blocks > ENGINE_LIMITS.maxApronBlocks)
    throw new InputError(
      'basinWidth',
      'too-many-blocks',
      `basinWidth: ${rows} rows of ${rowA.count} baffle piers (${blocks} in all) would be needed, more than the ${ENGINE_LIMITS.maxApronBlocks} one apron may hold; the basin is far wider than its flow needs`,
      { count: blocks, max: ENGINE_LIMITS.maxApronBlocks },
    );
  return {
    type: 'usbr-9',
    width: W,
    q,
    criticalDepth: yc,
    criticalVelocity: Math.cbrt(G * q),
    baffleHeight: h,
    baffleWidth: bw,
    rowSpacing: spacing,
    rows,
    slope,
    slopeLength,
    length: slopeLength * (slope / Math.sqrt(1 + slope * slope)),
    wallHeight: d.type9WallHeightRatio * h,
    rowA,
    rowB,
    warnings,
    sources: [
      'q ≤ 5.6 m²/s [src: Design of Small Dams]',
      'baffle height 0.8·yc, width and space 1.5·h, rows 2·h apart on a 2:1 slope, walls 3·h, ≥ 4 rows [mem: Design of Small Dams]',
    ],
  };
}

export const usbr9: DissipatorModule = {
  id: 'usbr-9',
  name: DISSIPATOR_NAMES['usbr-9'],
  source: 'USBR, Design of Small Dams; EM-25 (Peterka 1958) Basin IX',
  family: 'baffled-apron',
  description:
    'Rows of baffle piers on a 2:1 apron that carries the flow down a drop; entry near critical, no tailwater needed.',
  limits: [
    {
      criterion: 'unitDischarge',
      text: 'q ≤ {q}',
      quotes: { q: published('type9MaxUnitDischarge') },
      tag: TAG,
    },
    {
      criterion: 'froude',
      text: 'flow enters near critical depth (upstream of the drop)',
      tag: TAG,
    },
    {
      criterion: 'tailwater',
      text: 'needs no tailwater; rows continue below the channel bed',
      tag: TAG,
    },
  ],
  screenRow(row, ctx, d) {
    const approach =
      ctx.inflow === 'chute' || ctx.inflow === 'drop'
        ? crit('froude', 'pass', 'apron-entry-over-crest', {}, row.Q)
        : row.fr1 <= d.type9MaxApproachFroude
          ? crit('froude', 'pass', 'apron-entry-near-critical', { fr: row.fr1 }, row.Q)
          : crit('froude', 'fail', 'apron-entry-supercritical', { fr: row.fr1 }, row.Q, TAG);
    const q = { q: udis(row.q), limit: lim(d, 'type9MaxUnitDischarge') };
    return [
      approach,
      row.q <= d.type9MaxUnitDischarge
        ? crit('unitDischarge', 'pass', 'unit-discharge-within', q, row.Q, TAG)
        : crit('unitDischarge', 'fail', 'unit-discharge-exceeds', q, row.Q, TAG),
      crit('tailwater', 'pass', 'needs-no-tailwater', {}, row.Q),
    ];
  },
  screenFixed(ctx) {
    return [debrisCriterion(ctx, 'warn', 'pass', 'debris-apron-baffles')];
  },
};
