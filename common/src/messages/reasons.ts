// Sentences for the screening's coded reasons (basins/types.ts ReasonCode) and each type's summary,
// in SI or US customary. The quantities arrive SI with their kinds; quote.ts says them.
import type { TypeScreening } from '../basins/screening';
import type { CriterionResult, InflowKind, LimitEntry, ReasonCode } from '../basins/types';
import { quote } from '../warnings';
import type { UnitSystem } from '../range/types';
import { formatQuantity, sayer, type Say } from './quote';

type Sentence = (c: CriterionResult, say: Say) => string;

const inflow = (k: InflowKind | undefined): string => k ?? 'other';
const what: Record<string, string> = {
  'debris-plain-apron': 'a plain apron has nothing to catch it',
  'debris-blocks-teeth': 'chute blocks and sill teeth can snag large debris',
  'debris-piers': 'baffle piers catch floating debris and ice',
  'debris-deflectors': 'the deflector blocks can snag large debris',
  'debris-saf-blocks': 'the blocks catch large debris',
  'debris-under-baffle':
    'debris can clog the space under the baffle (the flow then passes over it)',
  'debris-apron-baffles': 'rows of baffles catch floating debris',
  'debris-riprap': 'riprap is not harmed by debris',
};
const debris =
  (code: string): Sentence =>
  (c) =>
    `${c.values.heavy === 1 ? 'heavy' : 'light'} debris: ${what[code]}`;
const range = (say: Say): string =>
  say.has('hi') ? `${say('lo')}–${say('hi')}` : `Fr1 ≥ ${say('lo')}`;

const SENTENCES: Record<ReasonCode, Sentence> = {
  'froude-below-range': (_c, say) =>
    `Fr1 ${say.pair('fr1', 'lo')} is below the tested range ${range(say)}`,
  'froude-above-range': (_c, say) =>
    `Fr1 ${say.pair('fr1', 'hi')} is above the tested range ${range(say)}`,
  'froude-at-least': (_c, say) => `Fr1 ${say('fr1')} is at least ${say('lo')}`,
  'froude-within': (_c, say) => `Fr1 ${say('fr1')} is within ${range(say)}`,
  'tailwater-unknown': (_c, say) =>
    `tailwater not known: this basin needs ${say('need')} (C ${say('factor')} × y2)`,
  'tailwater-short': (_c, say) =>
    `tailwater ${say.pair('tw', 'need')} is short of the ${say('need')} needed (C ${say('factor')} × y2 ${say('y2')}): the jump would sweep out`,
  'tailwater-drowned-design': (_c, say) =>
    `tailwater ${say('tw')} is ${say('ratio')}× the ${say('need')} needed at the design discharge: excess submergence, the jump is drowned and dissipates less`,
  'tailwater-drowned-partial': (_c, say) =>
    `tailwater ${say('tw')} is ${say('ratio')}× the ${say('need')} needed: a drowned jump at this partial flow (acceptable, less dissipation)`,
  'tailwater-holds': (_c, say) =>
    `tailwater ${say('tw')} holds the jump (needs ${say('need')} = C ${say('factor')} × y2)`,
  'debris-unstated': () => 'no debris stated',
  'debris-none': () => 'no debris expected',
  'debris-plain-apron': debris('debris-plain-apron'),
  'debris-blocks-teeth': debris('debris-blocks-teeth'),
  'debris-piers': debris('debris-piers'),
  'debris-deflectors': debris('debris-deflectors'),
  'debris-saf-blocks': debris('debris-saf-blocks'),
  'debris-under-baffle': debris('debris-under-baffle'),
  'debris-apron-baffles': debris('debris-apron-baffles'),
  'debris-riprap': debris('debris-riprap'),
  'discharge-no-limit': (_c, say) => `no published limit on total discharge (Q ${say('Q')})`,
  'unit-discharge-no-limit': (_c, say) => `no published limit on unit discharge (q ${say('q')})`,
  'plain-apron-not-supercritical': (_c, say) =>
    `Fr1 ${say('fr1')} ≤ 1: the inflow is not supercritical, no jump forms`,
  'plain-apron-weak-jump': (c, say) =>
    `Fr1 ${say('fr1')}: ${(c.values.fr1 ?? 0) < 1.7 ? 'undular' : 'weak'} jump, little energy to lose; a plain apron serves`,
  'plain-apron-oscillating': (_c, say) =>
    `Fr1 ${say('fr1')} in 2.5–4.5: oscillating jump, waves travel downstream (a Type IV basin or wave suppressors)`,
  'plain-apron-steady': (_c, say) => `Fr1 ${say('fr1')}: steady jump`,
  'plain-apron-strong': (_c, say) =>
    `Fr1 ${say('fr1')} > 9: strong jump; the plain apron is long (≈ 6·y2); a basin with blocks is shorter`,
  'no-blocks-velocity': (_c, say) => `no blocks to cavitate (V1 ${say('v1')})`,
  'no-piers-velocity': (_c, say) => `no baffle piers: suits high inflow velocity (V1 ${say('v1')})`,
  'unit-discharge-within-tested': (_c, say) => `q ${say('q')} is within the tested ${say('limit')}`,
  'unit-discharge-above-tested': (_c, say) =>
    `q ${say.beyond('q', 'limit', 'exceeds the tested')}: model study`,
  'velocity-within': (_c, say) => `V1 ${say('v1')} ≤ ${say('limit')}`,
  'piers-cavitation-risk': (_c, say) =>
    `V1 ${say.beyond('v1', 'limit', 'is above')}: cavitation risk on the baffle piers, model study`,
  'piers-would-cavitate': (_c, say) =>
    `V1 ${say.beyond('v1', 'limit', 'is above')}: baffle piers would cavitate; use Type II`,
  'unit-discharge-within': (_c, say) => `q ${say('q')} ≤ ${say('limit')}`,
  'unit-discharge-above-tests': (_c, say) =>
    `q ${say.beyond('q', 'limit', 'is above the')} of the tests`,
  'deflectors-cavitation-risk': (_c, say) =>
    `V1 ${say.beyond('v1', 'limit', 'is above')}: cavitation risk on the deflector blocks`,
  'unit-discharge-small': (_c, say) =>
    `q ${say('q')}: the type suits small unit discharges; no figure is published`,
  'chute-blocks-cavitation-risk': (_c, say) =>
    `V1 ${say.beyond('v1', 'limit', 'is above')}: cavitation risk on the chute blocks, model study`,
  'chute-blocks-not-advised': (_c, say) =>
    `V1 ${say.beyond('v1', 'limit', 'is above')}: chute blocks not advised`,
  'unit-discharge-small-structures': (_c, say) =>
    `q ${say('q')}: no published limit (the type is meant for small structures)`,
  'discharge-within': (_c, say) => `Q ${say('Q')} ≤ ${say('limit')}`,
  'discharge-above-type': (_c, say) => `Q ${say.beyond('Q', 'limit', 'exceeds the')} of the type`,
  'entry-velocity-within': (_c, say) => `V ${say('v')} ≤ ${say('limit')}`,
  'entry-velocity-above': (_c, say) => `V ${say.beyond('v', 'limit', 'exceeds')}`,
  'needs-no-tailwater': (_c, say) =>
    'needs no tailwater' +
    (say.has('tw') ? ` (tailwater ${say('tw')} stays below the baffle)` : ''),
  'baffle-overtopped': (_c, say) =>
    `tailwater ${say('tw')} overtops the baffle zone (> ${say('max')}): less dissipation`,
  'impact-inflow-outlet': (c) => `a ${inflow(c.inflow)} outlet: the type was developed for it`,
  'impact-inflow-chute': () => 'developed for pipe outlets; usable with a small open chute',
  'impact-inflow-other': (c) =>
    `a ${inflow(c.inflow)} inflow: the type needs a pipe, culvert or small chute entering the box`,
  'apron-entry-over-crest': () =>
    'the flow would enter the baffled apron over the crest near critical depth (the apron replaces the smooth chute)',
  'apron-entry-near-critical': (_c, say) => `entry Fr ${say('fr')} is near critical`,
  'apron-entry-supercritical': (_c, say) =>
    `entry Fr ${say('fr')} is well above critical: the type needs a near-critical approach`,
  'unit-discharge-exceeds': (_c, say) => `q ${say.beyond('q', 'limit', 'exceeds')}`,
  'outlet-froude-low': (_c, say) => `outlet Fr ${say('fr')} ≤ ${say('limit')}`,
  'outlet-froude-high': (_c, say) =>
    `outlet Fr ${say('fr')} > ${say('limit')}: a basin suits better`,
  'apron-tailwater-unknown': () =>
    'tailwater not known: the stone is sized for 0.4·D (conservative)',
  'apron-tailwater-perched': () =>
    'tailwater is below the outlet invert (free outfall): the relation is held at 0.4 × rise',
  'apron-tailwater-outside': (_c, say) =>
    `tailwater ${say('tw')} is outside 0.4–1.0 × rise (${say('low')}–${say('rise')}): the relation is held at its bound`,
  'apron-tailwater-within': (_c, say) => `tailwater ${say('tw')} within 0.4–1.0 × rise`,
  'apron-stone': (_c, say) => `apron stone D50 ${say('d50')}`,
  'apron-stone-too-large': (_c, say) =>
    `apron stone D50 ${say('d50')} exceeds the largest class ${say('max')}: use a basin`,
  'apron-inflow-outlet': (c) => `a ${inflow(c.inflow)} outlet`,
  'apron-inflow-other': (c) =>
    `an apron protects a culvert outlet; this inflow is a ${inflow(c.inflow)}`,
  'no-culvert': () => 'no culvert given',
  'culvert-rise-within': (_c, say) => `rise ${say('rise')} ≤ ${say('limit')}`,
  'culvert-rise-above': (_c, say) => `rise ${say.beyond('rise', 'limit', 'exceeds')}`,
  'no-discharges': () => 'no discharges to screen',
  'jet-velocity-high': (_c, say) =>
    `V1 ${say('v1')} at the design discharge is beyond ${say('limit')}, where basins with blocks become doubtful`,
  'jet-velocity-low': (_c, say) => `V1 ${say('v1')} ≤ ${say('limit')}: a stilling basin can serve`,
  'jet-head-high': (_c, say) =>
    `head ${say('head')} above the floor exceeds ${say('limit')} (common practice)`,
  'jet-head-low': (_c, say) => `head ${say('head')} ≤ ${say('limit')} (common practice)`,
  'tailwater-not-known': () => 'tailwater not known',
  'bucket-tailwater-deep': (_c, say) =>
    `tailwater at bed level is ≥ ${say('ratio')}× the sequent depth at every discharge: deep tailwater suits a submerged bucket`,
  'bucket-tailwater-shallow': (_c, say) =>
    `tailwater at bed level is only ${say('ratio')}× the sequent depth at ${say('Q')}: a submerged bucket needs deeper tailwater`,
};

/** Every code of the screening's reasons (for tests and documentation). */
export const REASON_CODES = Object.keys(SENTENCES) as ReasonCode[];

/**
 * The sentence of a screening reason in a unit system, with its source tag and, in a type's
 * summary, how many other discharges share it.
 * @example reasonText(screening[0].criteria[0], 'US')
 */
export function reasonText(c: CriterionResult, units: UnitSystem = 'SI'): string {
  const u: UnitSystem = units === 'US' ? 'US' : 'SI';
  const text = SENTENCES[c.code](c, sayer(c, u));
  const tag = c.source ? ` ${c.source}` : '';
  const n = c.others ?? 0;
  const more = n > 0 ? ` (and at ${n} other discharge${n > 1 ? 's' : ''})` : '';
  return text + tag + more;
}

/**
 * The summary of one type's screening in plain words, in a unit system: its verdict, the reasons
 * behind it, and its basin length.
 * @example screeningSummaryText(result.screening[0], result.screening, 'SI')
 */
export function screeningSummaryText(
  r: TypeScreening,
  all: readonly TypeScreening[],
  units: UnitSystem = 'SI',
): string {
  const u: UnitSystem = units === 'US' ? 'US' : 'SI';
  const reasons = (list: readonly CriterionResult[]): string =>
    list.map((c) => reasonText(c, u)).join('; ');
  const fails = r.criteria.filter((c) => c.status === 'fail');
  const warns = r.criteria.filter((c) => c.status === 'warn');
  const len =
    r.length !== undefined ? ` Basin length about ${formatQuantity(r.length, 'length', u)}.` : '';
  const best = all.find((s) => s.verdict === 'recommended');
  switch (r.verdict) {
    case 'recommended':
      return warns.length === 0
        ? `Recommended: passes every criterion at every discharge and ranks first.${len}`
        : `Recommended with cautions: ${reasons(warns)}.${len}`;
    case 'suitable':
      return `Suitable: passes every criterion${best ? `; ranks after ${best.name}` : ''}.${len}`;
    case 'marginal':
      return `Usable with cautions: ${reasons(warns)}.${len}`;
    case 'specialist':
      return `Likely answer: ${reasons(r.criteria.filter((c) => c.status === 'pass'))}. Needs a specialist study (usually with a physical model); not sized here.`;
    case 'unsuitable':
      if (r.family === 'jet') return `Not indicated: ${reasons(r.criteria)}.`;
      return `Unsuitable: ${reasons(fails)}.`;
  }
}

/**
 * A published limit of the catalogue (LimitEntry) in words, its quantities in the project's
 * units: a figure published in US customary reads exactly as published in a US project (50 ft/s,
 * never 49.2 ft/s), and its exact conversion in SI.
 * @example limitEntryText(getDissipator('usbr-6').limits[1], 'US') // 'entering velocity up to 50 ft/s'
 */
export function limitEntryText(entry: LimitEntry, units: UnitSystem = 'SI'): string {
  const say = sayer(quote(entry.quotes ?? {}), units);
  return entry.text.replace(/\{(\w+)\}/g, (_, name: string) => say(name));
}
