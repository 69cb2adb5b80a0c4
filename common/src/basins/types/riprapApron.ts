// Riprap apron at a small culvert outlet (HEC-14 ch. 10).
import { culvertApronStoneSize, APRON_CLASSES } from '../riprap';
import { BASIN_DEFAULTS } from '../defaults';
import type { DissipatorModule } from '../types';
import { crit, debrisCriterion, len } from './shared';
import { DISSIPATOR_NAMES } from '../names';

const TAG = '[src: HEC-14 (2006) ch. 10]';
const MAX_D50 = APRON_CLASSES[APRON_CLASSES.length - 1]!.d50;

export const riprapApron: DissipatorModule = {
  id: 'riprap-apron',
  name: DISSIPATOR_NAMES['riprap-apron'],
  source: 'FHWA HEC-14 (2006) ch. 10',
  family: 'riprap-apron',
  description:
    'A flat apron of riprap at a small culvert outlet: cheap where velocity and Froude number are modest.',
  limits: [
    {
      criterion: 'culvertSize',
      text: 'culvert rise up to {rise}',
      quotes: { rise: len(BASIN_DEFAULTS.apronMaxRise) },
      tag: TAG,
    },
    {
      criterion: 'tailwater',
      text: 'stone relation valid for tailwater 0.4–1.0 × rise',
      tag: '[src: HEC-14 eq. 10.4]',
    },
    { criterion: 'froude', text: 'outlet Froude number up to about 2.5', tag: '[mem: HEC-14]' },
    {
      criterion: 'stoneSize',
      text: 'D50 up to the largest class ({d50})',
      quotes: { d50: len(MAX_D50) },
      tag: '[mem: HEC-14 Table 10.1]',
    },
  ],
  screenRow(row, ctx, d) {
    const fr = { fr: row.fr1, limit: d.apronMaxFroude };
    const out = [
      row.fr1 <= d.apronMaxFroude
        ? crit('froude', 'pass', 'outlet-froude-low', fr, row.Q, '[mem: HEC-14]')
        : crit('froude', 'warn', 'outlet-froude-high', fr, row.Q, '[mem: HEC-14]'),
    ];
    const c = ctx.culvert;
    if (!c) return out;
    const D = c.rise;
    // A perched outlet (tailwater below its invert) discharges freely: tailwater 0 above the invert.
    const perched = row.tailwaterDepth !== undefined && row.tailwaterDepth < 0;
    const tw = row.tailwaterDepth === undefined ? undefined : Math.max(0, row.tailwaterDepth);
    const eq = '[src: HEC-14 eq. 10.4]';
    out.push(
      tw === undefined
        ? crit('tailwater', 'warn', 'apron-tailwater-unknown', {}, row.Q)
        : perched
          ? crit('tailwater', 'warn', 'apron-tailwater-perched', {}, row.Q, eq)
          : tw < 0.4 * D || tw > D
            ? crit(
                'tailwater',
                'warn',
                'apron-tailwater-outside',
                { tw: len(tw), low: len(0.4 * D), rise: len(D) },
                row.Q,
                eq,
              )
            : crit('tailwater', 'pass', 'apron-tailwater-within', { tw: len(tw) }, row.Q),
    );
    const stone = culvertApronStoneSize({
      Q: row.Q,
      rise: D,
      shape: c.shape,
      ...(c.span !== undefined ? { span: c.span } : {}),
      ...(tw !== undefined ? { tailwater: tw } : {}),
    });
    out.push(
      stone.d50 <= MAX_D50
        ? crit('stoneSize', 'pass', 'apron-stone', { d50: len(stone.d50) }, row.Q, eq)
        : crit(
            'stoneSize',
            'fail',
            'apron-stone-too-large',
            { d50: len(stone.d50), max: len(MAX_D50) },
            row.Q,
            '[mem: HEC-14]',
          ),
    );
    return out;
  },
  screenFixed(ctx, d) {
    const c = ctx.culvert;
    const inflow =
      ctx.inflow === 'culvert' || ctx.inflow === 'pipe'
        ? crit('inflow', 'pass', 'apron-inflow-outlet')
        : crit('inflow', 'fail', 'apron-inflow-other');
    inflow.inflow = ctx.inflow;
    const rise = c ? { rise: len(c.rise), limit: len(d.apronMaxRise) } : {};
    const size = !c
      ? crit('culvertSize', 'fail', 'no-culvert')
      : c.rise <= d.apronMaxRise
        ? crit('culvertSize', 'pass', 'culvert-rise-within', rise, undefined, TAG)
        : crit('culvertSize', 'fail', 'culvert-rise-above', rise, undefined, TAG);
    return [inflow, size, debrisCriterion(ctx, 'pass', 'pass', 'debris-riprap')];
  },
};
