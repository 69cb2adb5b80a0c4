// Riprap apron at a small culvert outlet (HEC-14 ch. 10).
import { culvertApronStoneSize, APRON_CLASSES } from '../riprap';
import type { DissipatorModule } from '../types';
import { crit, debrisCriterion, n3, ph } from './shared';

const TAG = '[src: HEC-14 (2006) ch. 10]';
const MAX_D50 = APRON_CLASSES[APRON_CLASSES.length - 1]!.d50;

export const riprapApron: DissipatorModule = {
  id: 'riprap-apron',
  name: 'Riprap apron (culvert outlet)',
  source: 'FHWA HEC-14 (2006) ch. 10',
  family: 'riprap-apron',
  description:
    'A flat apron of riprap at a small culvert outlet: cheap where velocity and Froude number are modest.',
  limits: [
    { criterion: 'culvertSize', text: 'culvert rise up to 1.5 m', tag: TAG },
    {
      criterion: 'tailwater',
      text: 'stone relation valid for tailwater 0.4–1.0 × rise',
      tag: '[src: HEC-14 eq. 10.4]',
    },
    { criterion: 'froude', text: 'outlet Froude number up to about 2.5', tag: '[mem: HEC-14]' },
    {
      criterion: 'stoneSize',
      text: `D50 up to the largest class (${MAX_D50} m, about 1.8 ft)`,
      tag: '[mem: HEC-14 Table 10.1]',
    },
  ],
  screenRow(row, ctx, d) {
    const P = ph(ctx);
    const out = [
      row.fr1 <= d.apronMaxFroude
        ? crit(
            'froude',
            'pass',
            `outlet Fr ${n3(row.fr1)} ≤ ${n3(d.apronMaxFroude)} [mem: HEC-14]`,
            row.Q,
          )
        : crit(
            'froude',
            'warn',
            `outlet Fr ${n3(row.fr1)} > ${n3(d.apronMaxFroude)}: a basin suits better [mem: HEC-14]`,
            row.Q,
          ),
    ];
    const c = ctx.culvert;
    if (!c) return out;
    const D = c.rise;
    // A perched outlet (tailwater below its invert) discharges freely: tailwater 0 above the invert.
    const perched = row.tailwaterDepth !== undefined && row.tailwaterDepth < 0;
    const tw = row.tailwaterDepth === undefined ? undefined : Math.max(0, row.tailwaterDepth);
    out.push(
      tw === undefined
        ? crit(
            'tailwater',
            'warn',
            'tailwater not known: the stone is sized for 0.4·D (conservative)',
            row.Q,
          )
        : perched
          ? crit(
              'tailwater',
              'warn',
              `tailwater is below the outlet invert (free outfall): the relation is held at 0.4 × rise [src: HEC-14 eq. 10.4]`,
              row.Q,
            )
          : tw < 0.4 * D || tw > D
            ? crit(
                'tailwater',
                'warn',
                `tailwater ${P.len(tw)} is outside 0.4–1.0 × rise (${P.num(0.4 * D, 'length')}–${P.len(D)}): the relation is held at its bound [src: HEC-14 eq. 10.4]`,
                row.Q,
              )
            : crit('tailwater', 'pass', `tailwater ${P.len(tw)} within 0.4–1.0 × rise`, row.Q),
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
        ? crit(
            'stoneSize',
            'pass',
            `apron stone D50 ${P.len(stone.d50)} [src: HEC-14 eq. 10.4]`,
            row.Q,
          )
        : crit(
            'stoneSize',
            'fail',
            `apron stone D50 ${P.len(stone.d50)} exceeds the largest class ${P.len(MAX_D50)}: use a basin [mem: HEC-14]`,
            row.Q,
          ),
    );
    return out;
  },
  screenFixed(ctx, d) {
    const P = ph(ctx);
    const c = ctx.culvert;
    const inflow =
      ctx.inflow === 'culvert' || ctx.inflow === 'pipe'
        ? crit('inflow', 'pass', `a ${ctx.inflow} outlet`)
        : crit(
            'inflow',
            'fail',
            `an apron protects a culvert outlet; this inflow is a ${ctx.inflow}`,
          );
    const size = !c
      ? crit('culvertSize', 'fail', 'no culvert given')
      : c.rise <= d.apronMaxRise
        ? crit('culvertSize', 'pass', `rise ${P.len(c.rise)} ≤ ${P.len(d.apronMaxRise)} ${TAG}`)
        : crit(
            'culvertSize',
            'fail',
            `rise ${P.len(c.rise)} exceeds ${P.len(d.apronMaxRise)} ${TAG}`,
          );
    return [inflow, size, debrisCriterion(ctx, 'pass', 'pass', 'riprap is not harmed by debris')];
  },
};
