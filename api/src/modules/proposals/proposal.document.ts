// The proposal as a pdfmake document definition, built from one issued version: pure (no I/O,
// no clock — the caller passes the time), so the worker renders exactly what a test reads.
// Numbers come in the project's units through the one formatter (unitFormat) and the one
// phraser of warnings (studyWarningText); the charts and the drawing are the same SVG builders
// the web uses (common/src/charts, common/src/drawing).
import {
  chartToSvg,
  drawingToSvg,
  energyChartSpec,
  formatTakeoff,
  phraseMessage,
  rangeChartSpec,
  studyCautions,
  studyWarningText,
  takeoffLineLabel,
  tornadoSvg,
  reasonText,
  screeningSummaryText,
  toSIValue,
  unitFormat,
  UNIT_LABELS,
  type DrawingFormatter,
  type Plan,
  type QuantityKind,
  type ReviewState,
  type StudyInput,
  type StudyResult,
  type TakeoffLine,
  type UncertainInput,
  type UnitSystem,
  UNCERTAIN_INPUT_NAMES,
  UNCERTAIN_KIND,
} from '@basinwright/common';
import type { EstimateView } from '../estimates/estimates.service';
import type { ProposalUncertainty } from './proposal.uncertainty';

/** The firm's branding on a paid plan (null on Concept: the watermark instead). */
export interface ProposalBrand {
  color: string | null;
  logo: { type: string; data: Buffer } | null;
  footer: string | null;
}

/** Everything the proposal prints, gathered by the service from the database. */
export interface ProposalSource {
  firm: { name: string; plan: Plan; brand: ProposalBrand | null; sealStatement: string | null };
  project: { name: string; client: string; location: string; units: UnitSystem };
  version: {
    number: number;
    /** as saved, in the project's units */
    input: StudyInput;
    /** SI, as the server computed it */
    result: StudyResult;
    engineVersion: string;
    computedAt: Date;
    issuedByName: string;
    issuedAt: Date;
    note: string;
  };
  review: {
    state: ReviewState;
    reviewedByName: string | null;
    reviewedAt: Date | null;
    licence: string | null;
    jurisdiction: string | null;
    statement: string | null;
  };
  /**
   * the latest issued estimate priced from this version's result (its take-off SI, its money in
   * the price book's currency), or null: the proposal then says it is not priced yet
   */
  cost: EstimateView | null;
  /** when the PDF is made (the caller's clock) */
  generatedAt: Date;
  /**
   * how sure the floor is (issue 12). Left out by the service: the render process runs it
   * (proposalUncertainty) before drawing; null when it was not run (a version too long for the
   * page cap, refused anyway).
   */
  uncertainty?: ProposalUncertainty | null;
}

/** The text of the free plan's watermark (product.md). */
export const CONCEPT_WATERMARK = 'Concept plan';

const TEAL = '#0f6e6e';
const SLATE = '#334155';
const MUTED = '#64748b';

type Node = Record<string, unknown> | string;

const REVIEW_WORDS: Record<ReviewState, string> = {
  not_sent: 'Not reviewed: not sent for review',
  in_review: 'Not reviewed: in review, not yet approved',
  approved: 'Approved',
  returned: 'Not reviewed: returned by the reviewer with comments',
};

function day(d: Date): string {
  return d.toISOString().slice(0, 10);
}
function stamp(d: Date): string {
  return `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

/**
 * The engine's provenance tags become plain citations and their sources are collected:
 * "[src: USBR EM-25]" → "(USBR EM-25)"; a value recalled rather than read from the publication,
 * "[mem: EM-25]", → "(EM-25, to be verified against the publication)".
 */
function cite(text: string, refs: Set<string>): string {
  return text
    .replace(/\s*\[(src|mem): ([^\]]+)\]\s*/g, (_m, kind: string, src: string) => {
      refs.add(src.trim());
      return kind === 'src'
        ? ` (${src.trim()}) `
        : ` (${src.trim()}, to be verified against the publication) `;
    })
    .replace(/\s+/g, ' ')
    .trim();
}

/** The full titles of the publications the engine's short citations name (facts of the trade). */
const PUBLICATIONS: [RegExp, string][] = [
  [
    /EM-25|Peterka/,
    'Peterka, A. J. (1958). Hydraulic Design of Stilling Basins and Energy Dissipators. Engineering Monograph No. 25, U.S. Bureau of Reclamation.',
  ],
  [/Chow 1959/, 'Chow, V. T. (1959). Open-Channel Hydraulics. McGraw-Hill.'],
  [/Design of Small Dams/, 'U.S. Bureau of Reclamation. Design of Small Dams.'],
  [
    /HEC-14/,
    'Federal Highway Administration (2006). Hydraulic Design of Energy Dissipators for Culverts and Channels. Hydraulic Engineering Circular No. 14, 3rd ed.',
  ],
  [
    /Blaisdell/,
    'Blaisdell, F. W. (1948). Development and hydraulic design, Saint Anthony Falls stilling basin. Transactions of the ASCE, 113.',
  ],
  [/Henderson/, 'Henderson, F. M. (1966). Open Channel Flow. Macmillan.'],
];

/** The references list: the full titles of the publications cited, then any other source named. */
function referenceList(refs: Set<string>): string[] {
  const titles = new Set<string>();
  const others = new Set<string>();
  for (const r of refs) {
    const hits = PUBLICATIONS.filter(([re]) => re.test(r));
    if (hits.length) for (const [, title] of hits) titles.add(title);
    else others.add(r);
  }
  return [
    ...[...titles].sort((a, b) => a.localeCompare(b)),
    ...[...others].sort((a, b) => a.localeCompare(b)),
  ];
}

/** A data URL pdfmake can draw (PNG or JPEG only). */
function logoUrl(logo: ProposalBrand['logo']): string | null {
  if (logo === null || !/^image\/(png|jpeg)$/.test(logo.type)) return null;
  return `data:${logo.type};base64,${logo.data.toString('base64')}`;
}

function heading(text: string, color: string, pageBreak = false): Node {
  return {
    text,
    style: 'h1',
    color,
    ...(pageBreak ? { pageBreak: 'before' } : {}),
  };
}

function keyValueTable(rows: [string, string][]): Node {
  return {
    table: {
      widths: [180, '*'],
      body: rows.map(([k, v]) => [
        { text: k, color: SLATE },
        { text: v, bold: true },
      ]),
    },
    layout: 'lightHorizontalLines',
    margin: [0, 2, 0, 10],
  };
}

function assumptionKind(unit: string): QuantityKind | null {
  if (unit === '-' || unit === '°') return null;
  return (
    (Object.keys(UNIT_LABELS) as QuantityKind[]).find((k) => UNIT_LABELS[k].SI === unit) ?? null
  );
}

/** The inflow case in words, numbers as saved in the project's units. */
function inflowText(input: StudyInput, units: UnitSystem): string {
  const L = UNIT_LABELS.length[units];
  const i = input.inflow;
  const loss = (
    m: { kind: string; value?: number; Cv?: number; K?: number } | undefined,
  ): string =>
    m === undefined || m.kind === 'none'
      ? 'no losses'
      : m.kind === 'fraction'
        ? `losses ${Math.round((m.value ?? 0) * 100)} % of the head`
        : m.kind === 'velocityCoefficient'
          ? `velocity coefficient Cv = ${m.Cv}`
          : `loss coefficient K = ${m.K}`;
  switch (i.kind) {
    case 'chute': {
      const hw =
        i.headwater.kind === 'weir'
          ? `weir crest ${i.headwater.L} ${L} long, coefficient C = ${i.headwater.C} ${UNIT_LABELS.weirCoefficient[units]}`
          : `reservoir rating table (${i.headwater.rows.length} points)`;
      return `Chute or spillway from a crest at ${i.crestElevation} ${L}: ${hw}; ${loss(i.lossModel)}.`;
    }
    case 'gate':
      return `Sluice gate, contraction coefficient Cc = ${i.Cc}${i.opening !== undefined ? `, opening ${i.opening} ${L}` : ''}${i.upstreamDepth !== undefined ? `, upstream depth ${i.upstreamDepth} ${L}` : ''}${i.upstreamElevation !== undefined ? `, upstream water at ${i.upstreamElevation} ${L}` : ''}.`;
    case 'pipe':
      return `Pipe or culvert outlet, invert at ${i.invertElevation} ${L}: ${
        i.outlet.kind === 'barrel'
          ? `${i.outlet.section.shape} barrel, slope ${i.outlet.slope}, Manning's n ${i.outlet.manningN}`
          : `outlet table (${i.outlet.rows.length} points)`
      }; ${loss(i.lossModel)}.`;
    case 'known':
      return 'Toe depth and velocity given at the design discharge.';
  }
}

function tailwaterText(input: StudyInput, units: UnitSystem): string {
  const L = UNIT_LABELS.length[units];
  const t = input.tailwater;
  if (t.kind === 'table')
    return `Rating table of the downstream channel (${t.rows.length} points).`;
  const s = t.section;
  const shape =
    s.shape === 'rectangular'
      ? `rectangular, ${s.width} ${L} wide`
      : s.shape === 'trapezoidal'
        ? `trapezoidal, bottom ${s.bottomWidth} ${L}, side slopes ${s.sideSlope}H:1V`
        : `circular, ${s.diameter} ${L} across`;
  return `Normal depth (Manning's equation) in the downstream channel: ${shape}, slope ${t.slope}, n = ${t.manningN}.`;
}

const POSITION_WORDS: Record<string, string> = {
  'at-toe': 'at the toe',
  drowned: 'drowned',
  'swept-out': 'swept out',
  'leaves-basin': 'leaves the basin',
};

/** A quantity as printed: whole numbers from 100 up, else two decimals; thousands grouped. */
export function quantityText(value: number): string {
  const digits = Math.abs(value) >= 100 ? 0 : 2;
  return value.toLocaleString('en-US', {
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
  });
}

/** An amount of money as printed: whole units of the currency, thousands grouped. */
export function moneyText(value: number): string {
  return Math.round(value).toLocaleString('en-US', { maximumFractionDigits: 0 });
}

function pctText(fraction: number): string {
  return `${Number((fraction * 100).toFixed(2))} %`;
}

/**
 * The take-off by element in the project's units and the issued estimate: priced lines, the
 * percentages in their stated order, escalation, the total and its AACE accuracy range.
 */
function costSection(
  cost: EstimateView,
  totals: NonNullable<EstimateView['totals']>,
  book: NonNullable<EstimateView['priceBook']>,
  units: UnitSystem,
  accent: string,
): Node[] {
  const out: Node[] = [];
  const cur = book.currency;
  const right = (text: string, extra: Record<string, unknown> = {}) => ({
    text,
    alignment: 'right',
    ...extra,
  });
  const th = (text: string, alignment = 'left') => ({ text, style: 'th', alignment });
  const issued = cost.issuedAt === null ? '' : `, issued ${cost.issuedAt.slice(0, 10)}`;
  out.push({
    text: `From estimate revision ${cost.revision}${issued}${cost.issuedBy ? ` by ${cost.issuedBy}` : ''}, priced from this version's design result.`,
    margin: [0, 0, 0, 4],
  });

  out.push({ text: 'Quantities by element', style: 'h2', color: accent });
  const lines = formatTakeoff({ lines: cost.takeoffLines as TakeoffLine[] }, units);
  out.push({
    table: {
      headerRows: 1,
      widths: ['*', 80, 40],
      body: [
        [th('Item and element'), th('Quantity', 'right'), th('Unit')],
        ...lines.map((l) => [takeoffLineLabel(l.key), right(quantityText(l.value)), l.unit]),
      ],
    },
    layout: 'lightHorizontalLines',
    fontSize: 8.5,
  });
  out.push({
    text: "Take-off quantities with the waste and laps of the take-off assumptions, in the project's units.",
    fontSize: 8,
    color: MUTED,
    margin: [0, 4, 0, 6],
  });

  out.push({ text: `Estimate (${cur})`, style: 'h2', color: accent });
  out.push({
    table: {
      headerRows: 1,
      widths: ['*', 52, 34, 62, 72],
      body: [
        [
          th('Item'),
          th('Quantity', 'right'),
          th('Unit'),
          th(`Rate (${cur})`, 'right'),
          th(`Amount (${cur})`, 'right'),
        ],
        ...cost.lines.map((l) => [
          {
            text: [
              { text: `${takeoffLineLabel(l.key)}: ` },
              { text: `${l.code} ${l.description}`, color: SLATE },
              ...(l.override
                ? [{ text: ` (quantity set: ${l.override.reason})`, italics: true }]
                : []),
            ],
          },
          right(quantityText(l.quantityUsed)),
          l.unit,
          right(l.unitPrice.toLocaleString('en-US', { maximumFractionDigits: 2 })),
          right(moneyText(l.amount)),
        ]),
      ],
    },
    layout: 'lightHorizontalLines',
    fontSize: 8.5,
  });
  const s = cost.settings;
  const p = s.percentages;
  const a = totals.accuracy;
  const sum = (label: string, value: number, bold = false): Node[] => [
    { text: label, color: bold ? undefined : SLATE, bold },
    right(`${cur} ${moneyText(value)}`, { bold }),
  ];
  const summary: Node[] = [];
  summary.push({
    table: {
      widths: ['*', 120],
      body: [
        sum('Direct cost', totals.direct),
        sum(`Located cost (location factor × ${s.locationFactor})`, totals.located),
        sum(`Mobilisation (${pctText(p.mobilisation)} of located cost)`, totals.mobilisation),
        sum(`Care of water (${pctText(p.careOfWater)} of located cost)`, totals.careOfWater),
        sum(`Contingency (${pctText(p.contingency)})`, totals.contingency),
        sum(`Overhead and profit (${pctText(p.overheadAndProfit)})`, totals.overheadAndProfit),
        sum(
          `Escalation (${pctText(s.escalation.annualRate)} a year for ${s.escalation.years} years, compounded)`,
          totals.escalation,
        ),
        sum('Total', totals.total, true),
        [
          {
            text: `Accuracy range, AACE Class ${a.aaceClass} (${pctText(a.lowPct)} to +${pctText(a.highPct)})`,
            bold: true,
          },
          right(`${cur} ${moneyText(a.low)} to ${moneyText(a.high)}`, { bold: true }),
        ],
      ],
    },
    layout: 'lightHorizontalLines',
    margin: [0, 8, 0, 4],
  });
  // the totals and the range stay on one page
  out.push({ stack: summary, unbreakable: true });
  // the lines left out, grouped by why (most often: no price-book item chosen)
  const byReason = new Map<string, string[]>();
  for (const u of cost.unpriced)
    byReason.set(u.reason, [...(byReason.get(u.reason) ?? []), takeoffLineLabel(u.key)]);
  for (const [reason, keys] of byReason)
    out.push({
      text: [{ text: `Not priced — ${reason.replace(/\.$/, '')}: `, bold: true }, keys.join('; ')],
      fontSize: 8,
      color: SLATE,
      margin: [0, 2, 0, 2],
    });
  out.push({
    text: [
      `Unit rates come from the firm's price book "${book.name}" (${cur}), not from Basinwright. `,
      `Order of the amounts: ${cost.steps.join('; ')}. `,
      `Accuracy classes: ${a.source}.`,
    ].join(''),
    fontSize: 8,
    color: MUTED,
    margin: [0, 4, 0, 6],
  });
  return out;
}

/** A spread in words, a depth in the project's units, a factor as "× value". */
function spreadText(u: UncertainInput, units: UnitSystem): string {
  const f = unitFormat(units);
  const v = (x: number): string =>
    UNCERTAIN_KIND[u.key] === 'depth' ? f.withUnit(x, 'length') : `× ${x}`;
  const d = u.distribution;
  switch (d.kind) {
    case 'uniform':
      return `uniform, ${v(d.low)} to ${v(d.high)}`;
    case 'triangular':
      return `triangular, ${v(d.low)} to ${v(d.high)}, most likely ${v(d.mode)}`;
    case 'normal':
      return `normal, mean ${v(d.mean)}, standard deviation ${UNCERTAIN_KIND[u.key] === 'depth' ? f.withUnit(d.sd, 'length') : d.sd}, kept within ${v(d.low)} to ${v(d.high)}`;
  }
}

/** A probability as printed: a percentage to one decimal. */
export function percentText(p: number): string {
  return `${(p * 100).toFixed(1)} %`;
}

/**
 * How sure the floor is: the risk of sweep-out at the chosen floor with its sampling error, the
 * sample count and seed, the floor for the confidence asked, the tornado chart and the spreads.
 */
function uncertaintySection(
  u: ProposalUncertainty,
  units: UnitSystem,
  accent: string,
  refs: Set<string>,
): Node[] {
  const f = unitFormat(units);
  const out: Node[] = [heading('How sure the floor is', accent, true)];
  if ('refused' in u) {
    out.push({ text: `The uncertainty of the floor could not be analysed: ${u.refused}` });
    return out;
  }
  const { request, result } = u;
  const mc = result.monteCarlo;
  const level = `${Math.round(request.confidence * 100)} %`;
  const sentences = [
    `The tailwater, the inflow and the design discharge are each known only within a spread. With the spreads below, ${mc.samples.toLocaleString('en-US')} samples were drawn (seed “${mc.seed}”: the same seed gives the same figures) and the floor solved again for each.`,
    `Probability that the tailwater falls short of C·y2 (C = ${u.floor.tailwaterFactor}) at some analysed discharge on ${u.floor.basin ? `the floor of the ${u.floor.basin}` : 'the study floor'} (${f.withUnit(result.chosenFloor, 'length')}), so that the jump is swept out: ${percentText(mc.probability)}, with a sampling error (standard error) of ${percentText(mc.standardError)}.`,
  ];
  if (mc.mostOftenQ)
    sentences.push(
      `It happens most often at ${f.withUnit(mc.mostOftenQ.Q, 'discharge')}${mc.mostOftenQ.isDesign ? ' (the design discharge)' : ''}.`,
    );
  if (mc.noFloorCount > 0)
    sentences.push(`In ${mc.noFloorCount} samples no floor holds the jump at all.`);
  sentences.push(
    mc.floorAtConfidence
      ? `The floor that holds the jump in ${level} of the samples: ${f.withUnit(mc.floorAtConfidence.elevation, 'length')} (required as designed: ${f.withUnit(result.asDesigned.requiredElevation, 'length')}).`
      : `Too many samples have no floor that holds the jump to name the floor for ${level} of them.`,
  );
  out.push({ text: sentences.join(' '), margin: [0, 0, 0, 8] });
  if (result.sensitivity.length)
    out.push({
      svg: tornadoSvg(result.sensitivity, units, { fontFamily: 'Lato' }),
      width: 515,
    });
  out.push({
    text: 'Each bar is the change in the required floor with one input at its 5 % or 95 % point and the others as designed.',
    fontSize: 8,
    color: MUTED,
    margin: [0, 2, 0, 6],
  });
  out.push({ text: 'The spreads used', style: 'h2', color: accent });
  out.push({
    table: {
      headerRows: 1,
      widths: [80, 150, '*'],
      body: [
        ['Input', 'Spread', 'Basis'].map((t) => ({ text: t, style: 'th' })),
        ...request.inputs.map((x) => [
          UNCERTAIN_INPUT_NAMES[x.key],
          spreadText(x, units),
          { text: x.basis, fontSize: 7.5 },
        ]),
      ],
    },
    layout: 'lightHorizontalLines',
    fontSize: 8.5,
  });
  for (const x of request.inputs)
    for (const [re] of PUBLICATIONS) {
      const hit = re.exec(x.basis);
      if (hit) refs.add(hit[0]);
    }
  out.push({
    text: 'A sampled estimate: another seed gives slightly different figures, mostly within two standard errors. The spreads are the defaults of Basinwright, each naming its basis; where the engineer knows better, the analysis should be run again with theirs.',
    fontSize: 8,
    color: MUTED,
    margin: [0, 4, 0, 0],
  });
  return out;
}

/**
 * The proposal's pdfmake document definition. `maxPages` is checked by the caller from the
 * footer's page count (`pageCount.value`).
 */
export function proposalDocument(source: ProposalSource): {
  definition: Record<string, unknown>;
  pageCount: { value: number };
} {
  const { firm, project, version, review } = source;
  const units = project.units;
  const r = version.result;
  const f = unitFormat(units);
  const refs = new Set<string>();
  const brand = firm.brand;
  const accent = brand?.color ?? (brand ? TEAL : SLATE);
  const entry = r.design;
  const design = entry?.design ?? null;
  const designRow = r.rows[r.designIndex];
  const floor =
    design && (design.family === 'jump-basin' || design.family === 'impact-basin')
      ? design.floorElevation
      : design && design.family === 'riprap-apron'
        ? design.invertElevation
        : r.floor.elevation;
  const content: Node[] = [];

  // ——— Cover
  const logo = brand ? logoUrl(brand.logo) : null;
  content.push(
    brand
      ? {
          columns: [
            logo ? { image: logo, fit: [140, 60] } : { text: '' },
            { text: firm.name, style: 'firm', color: accent, alignment: 'right' },
          ],
          margin: [0, 0, 0, 60],
        }
      : {
          text: `${CONCEPT_WATERMARK} — prepared with Basinwright`,
          color: MUTED,
          margin: [0, 0, 0, 60],
        },
    { canvas: [{ type: 'rect', x: 0, y: 0, w: 515, h: 6, color: accent }] },
    { text: 'Energy dissipator — concept design proposal', style: 'title', margin: [0, 18, 0, 8] },
    { text: project.name, style: 'subtitle' },
    keyValueTable([
      ['Client', project.client || '—'],
      ['Location', project.location || '—'],
      ['Prepared by', firm.name],
      [
        'Issued version',
        `Version ${version.number}, issued ${day(version.issuedAt)} by ${version.issuedByName}`,
      ],
      ['Review', REVIEW_WORDS[review.state]],
      ['Units', units === 'SI' ? 'SI (metres, m³/s)' : 'US customary (feet, cfs)'],
      ['Date of this document', day(source.generatedAt)],
    ]),
    {
      text:
        'Concept level only. This proposal sets out a concept design for discussion and budgeting; ' +
        'it is not a construction design. See the cautions before relying on any figure.',
      italics: true,
      color: MUTED,
      margin: [0, 30, 0, 0],
    },
  );

  // ——— Key figures
  content.push(heading('Key figures', accent, true));
  content.push(
    keyValueTable([
      ['Design discharge', f.withUnit(r.input.designDischarge, 'discharge')],
      ['Chosen dissipator', design ? design.name : 'None of the catalogue types suits this site'],
      ['Basin floor elevation', f.withUnit(floor, 'length')],
      ['Basin width', f.withUnit(r.input.basinWidth, 'length')],
      ['Basin length', f.withUnit(design?.length, 'length')],
      ['Concrete (neat line)', f.withUnit(design?.concrete.total, 'volume')],
      ['Inflow Froude number at design', designRow ? designRow.fr1.toFixed(2) : '—'],
      ['Inflow velocity at design', f.withUnit(designRow?.v1, 'velocity')],
      ['Channel bed elevation', f.withUnit(r.input.channelBedElevation, 'length')],
      ['Engine version', `${version.engineVersion} (computed ${stamp(version.computedAt)})`],
    ]),
  );
  if (version.note) content.push({ text: `Note of the issuer: ${version.note}`, color: SLATE });

  // ——— Basis of design
  const input = version.input;
  const Q = UNIT_LABELS.discharge[units];
  const L = UNIT_LABELS.length[units];
  const range =
    input.discharges.kind === 'range'
      ? `${input.discharges.count} discharges from ${input.discharges.min} to ${input.discharges.max} ${Q}`
      : `${input.discharges.values.length} discharges listed: ${input.discharges.values.join(', ')} ${Q}`;
  content.push({ text: '', margin: [0, 12, 0, 0] }, heading('Basis of design', accent));
  content.push(
    keyValueTable([
      [
        'Design discharge',
        `${input.designDischarge} ${Q}${r.designDischargeAdded ? ' (added to the discharges checked)' : ''}`,
      ],
      ['Discharges checked', range],
      ['Tailwater', tailwaterText(input, units)],
      ['Inflow', inflowText(input, units)],
      ['Channel bed', `${input.channelBedElevation} ${L}`],
      ['Basin width', `${input.basinWidth} ${L}`],
      [
        'Jump length relation',
        r.input.jumpLengthMethod === 'usbr' || r.input.jumpLengthMethod === undefined
          ? 'USBR curve of jump length'
          : String(r.input.jumpLengthMethod),
      ],
      [
        'Floor',
        r.floor.fixed
          ? `Fixed by the engineer at ${f.withUnit(r.floor.elevation, 'length')}`
          : 'Solved: the highest floor that holds the jump at every discharge',
      ],
    ]),
  );
  const changed = (r.dissipators?.assumptions ?? []).filter(
    (a) => a.overridden || a.value !== a.defaultValue,
  );
  content.push({ text: 'Assumptions changed from their defaults', style: 'h2', color: accent });
  if (changed.length === 0)
    content.push({
      text: 'None: every assumption is at its published or common-practice default.',
    });
  else
    content.push({
      table: {
        headerRows: 1,
        widths: ['*', 70, 70, 120],
        body: [
          ['Assumption', 'Used', 'Default', 'Source of the default'].map((t) => ({
            text: t,
            style: 'th',
          })),
          ...changed.map((a) => {
            const kind = assumptionKind(a.unit);
            const show = (v: number): string =>
              kind ? f.withUnit(v, kind) : String(a.unit === '°' ? `${v}°` : v);
            return [
              a.label,
              { text: show(a.value), alignment: 'right' },
              { text: show(a.defaultValue), alignment: 'right' },
              { text: a.source, fontSize: 7.5 },
            ];
          }),
        ],
      },
      layout: 'lightHorizontalLines',
    });

  // ——— Results over the range
  const cols: { head: string; get: (row: StudyResult['rows'][number]) => string }[] = [
    { head: `Q (${Q})`, get: (x) => f.num(x.Q, 'discharge') },
    { head: `y1 (${L})`, get: (x) => f.num(x.y1, 'length') },
    { head: `V1 (${UNIT_LABELS.velocity[units]})`, get: (x) => f.num(x.v1, 'velocity') },
    { head: 'Fr1', get: (x) => x.fr1.toFixed(2) },
    { head: `y2 (${L})`, get: (x) => f.num(x.y2, 'length') },
    { head: `Tailwater depth (${L})`, get: (x) => f.num(x.tailwaterDepth, 'length') },
    { head: `C·y2 (${L})`, get: (x) => f.num(x.requiredDepth, 'length') },
    { head: `Margin (${L})`, get: (x) => f.num(x.margin, 'length') },
    { head: `Jump length (${L})`, get: (x) => f.num(x.length, 'length') },
    { head: 'Jump', get: (x) => POSITION_WORDS[x.position] ?? x.position },
  ];
  content.push(heading('Results over the discharge range', accent, true));
  content.push({
    text: `On the study floor at ${f.withUnit(r.floor.elevation, 'length')}, tailwater factor C = ${r.floor.tailwaterFactor}. The margin is the tailwater depth less C·y2: where it is ≤ 0 the tailwater cannot hold the jump at the toe. The design discharge is in bold. Least margin ${f.withUnit(r.floor.leastMargin.margin, 'length')} at ${f.withUnit(r.floor.leastMargin.Q, 'discharge')}.`,
    margin: [0, 0, 0, 6],
  });
  content.push({
    table: {
      headerRows: 1,
      widths: cols.map((c) => (c.head === 'Jump' ? 58 : '*')),
      body: [
        cols.map((c) => ({ text: c.head, style: 'th' })),
        ...r.rows.map((row) =>
          cols.map((c, i) => ({
            text: c.get(row),
            bold: row.isDesign,
            alignment: i === cols.length - 1 ? 'left' : 'right',
          })),
        ),
      ],
    },
    layout: 'lightHorizontalLines',
    fontSize: 8,
  });

  // ——— Charts (the same data the web charts use)
  const rangeRows =
    design && design.family === 'jump-basin' && r.chosenFloor ? design.rows : r.rows;
  const requiredLabel = `Required depth C·y2 (C = ${r.chosenFloor && design?.family === 'jump-basin' ? design.sizing.tailwaterFactor : r.floor.tailwaterFactor})`;
  content.push(heading('Charts', accent, true));
  content.push({
    text:
      rangeRows === r.rows
        ? 'On the study floor, over the discharges checked.'
        : `On the floor of the ${design?.name ?? 'chosen basin'} (${f.withUnit(floor, 'length')}), over the discharges checked.`,
    margin: [0, 0, 0, 6],
  });
  content.push({
    svg: chartToSvg(rangeChartSpec(rangeRows, units, requiredLabel), { fontFamily: 'Lato' }),
    width: 515,
  });
  const diagrams = r.chosenFloor?.designJump.diagrams ?? r.diagrams;
  content.push({ text: ' ', margin: [0, 6] });
  content.push({
    svg: chartToSvg(energyChartSpec(diagrams, units), { fontFamily: 'Lato' }),
    width: 515,
  });

  // ——— How sure the floor is
  if (source.uncertainty)
    content.push(...uncertaintySection(source.uncertainty, units, accent, refs));

  // ——— Basin choice
  content.push(heading('Basin choice', accent, true));
  if (entry && design) {
    const screened = r.screening.find((s) => s.type === entry.type);
    content.push({
      text: [
        { text: `${design.name}. `, bold: true },
        cite(screened ? screeningSummaryText(screened, r.screening, units) : '', refs),
      ],
      margin: [0, 0, 0, 6],
    });
    if (screened)
      content.push({
        ul: screened.criteria.map(
          (c) =>
            `${c.status === 'pass' ? 'Meets' : c.status === 'warn' ? 'Marginal' : 'Fails'}: ${cite(reasonText(c, units), refs)}`,
        ),
        margin: [0, 0, 0, 8],
      });
  } else content.push({ text: 'No catalogue type suits this site; see the screening below.' });
  content.push({ text: 'Every type screened, in rank order', style: 'h2', color: accent });
  content.push({
    table: {
      headerRows: 1,
      widths: [120, 62, '*'],
      body: [
        ['Type', 'Verdict', 'Why'].map((t) => ({ text: t, style: 'th' })),
        ...r.screening.map((s) => [
          { text: s.name, bold: s.type === entry?.type },
          s.verdict,
          { text: cite(screeningSummaryText(s, r.screening, units), refs), fontSize: 8 },
        ]),
      ],
    },
    layout: 'lightHorizontalLines',
    fontSize: 8.5,
  });
  if (r.alternatives.length) {
    content.push({ text: 'Alternatives compared', style: 'h2', color: accent });
    const alt = (e: NonNullable<StudyResult['design']>) => {
      const d = e.design;
      const z =
        d.family === 'jump-basin' || d.family === 'impact-basin'
          ? d.floorElevation
          : d.family === 'riprap-apron'
            ? d.invertElevation
            : null;
      return [
        { text: d.name, bold: e === entry },
        { text: f.num(z, 'length'), alignment: 'right' },
        { text: f.num(d.length, 'length'), alignment: 'right' },
        { text: f.num(d.concrete.total, 'volume'), alignment: 'right' },
        e.verdict,
      ];
    };
    content.push({
      table: {
        headerRows: 1,
        widths: ['*', 70, 70, 80, 70],
        body: [
          [
            'Type',
            `Floor (${L})`,
            `Length (${L})`,
            `Concrete (${UNIT_LABELS.volume[units]})`,
            'Verdict',
          ].map((t) => ({ text: t, style: 'th' })),
          ...(entry ? [alt(entry)] : []),
          ...r.alternatives.map(alt),
        ],
      },
      layout: 'lightHorizontalLines',
      fontSize: 8.5,
    });
  }

  // ——— Drawing (landscape page)
  if (entry) {
    const format: DrawingFormatter = (value, quantity) =>
      quantity === 'count'
        ? String(Math.round(value))
        : quantity === 'discharge'
          ? f.withUnit(value, 'discharge', 1)
          : f.withUnit(value, 'length', 2);
    content.push({
      text: 'Plan and section',
      style: 'h1',
      color: accent,
      pageBreak: 'before',
      pageOrientation: 'landscape',
    });
    content.push({
      svg: drawingToSvg(entry.drawing, {
        format,
        width: 960,
        fontFamily: 'Lato',
        scaleUnit: { label: L, metres: toSIValue(1, 'length', units) },
        // pdfmake's SVG renderer ignores paint-order: a halo painted over its text left every
        // label white on the white sheet
        halo: 'underlay',
      }),
      fit: [760, 440],
    });
  }

  // ——— Exit protection and slab flotation
  content.push({
    text: 'Exit protection and slab flotation',
    style: 'h1',
    color: accent,
    pageBreak: 'before',
    pageOrientation: 'portrait',
  });
  const rip = design && 'riprap' in design ? design.riprap : null;
  const slab = design && design.family === 'jump-basin' ? design.slab : null;
  if (rip) {
    content.push({ text: 'Riprap below the basin', style: 'h2', color: accent });
    content.push(
      keyValueTable([
        ['Exit velocity', f.withUnit(rip.velocity, 'velocity')],
        ['Median stone size D50', f.withUnit(rip.d50, 'length')],
        ['Layer thickness', f.withUnit(rip.thickness, 'length')],
        [
          'Length × width',
          `${f.withUnit(rip.length, 'length')} × ${f.withUnit(rip.width, 'length')}`,
        ],
        ['Bedding', rip.bedding],
      ]),
    );
  }
  if (slab) {
    content.push({ text: 'Floor slab against uplift', style: 'h2', color: accent });
    content.push(
      keyValueTable([
        ['Slab thickness used', f.withUnit(slab.thickness, 'length')],
        [
          'Thickness required',
          `${f.withUnit(slab.requiredThickness, 'length')} (governed by ${slab.governedBy})`,
        ],
        ['Uplift head', f.withUnit(slab.upliftHead, 'length')],
        [
          'Safety factor against flotation',
          `${slab.safetyFactorAchieved?.toFixed(2) ?? '—'} achieved, ${slab.safetyFactorRequired.toFixed(2)} required`,
        ],
      ]),
    );
    for (const n of slab.notes) content.push({ text: studyWarningText(n, units), color: SLATE });
  }
  if (!rip && !slab)
    content.push({
      text: 'The chosen dissipator has no riprap or floor slab sized by this study.',
    });

  // ——— Quantities and cost
  const cost = source.cost;
  const priced = cost !== null && cost.totals !== null && cost.priceBook !== null;
  // a priced section (take-off and estimate) is long: it starts on its own page
  content.push(heading('Quantities and cost', accent, priced));
  if (cost !== null && cost.totals !== null && cost.priceBook !== null)
    content.push(...costSection(cost, cost.totals, cost.priceBook, units, accent));
  else {
    if (design) {
      const c = design.concrete;
      const V = UNIT_LABELS.volume[units];
      content.push({
        table: {
          headerRows: 1,
          widths: ['*', 100],
          body: [
            [
              { text: 'Concrete by element (neat line)', style: 'th' },
              { text: `Volume (${V})`, style: 'th', alignment: 'right' },
            ],
            ...(
              [
                ['Floor slab', c.slab],
                ['Walls', c.walls],
                ['Wingwalls', c.wingwalls],
                ['Cutoffs', c.cutoffs],
                ['Blocks', c.blocks],
                ['End sill', c.sill],
              ] as [string, number][]
            ).map(([k, v]) => [k, { text: f.num(v, 'volume'), alignment: 'right' }]),
            [
              { text: 'Total', bold: true },
              { text: f.num(c.total, 'volume'), alignment: 'right', bold: true },
            ],
          ],
        },
        layout: 'lightHorizontalLines',
      });
      content.push({
        text: `Basis: ${c.basis}.`,
        fontSize: 8,
        color: MUTED,
        margin: [0, 4, 0, 6],
      });
    }
    content.push({
      text: 'Quantities and cost: not priced yet. The full take-off (reinforcement, formwork, excavation, backfill, riprap and bedding) and the estimate with its accuracy range are not part of this version.',
      bold: true,
      color: SLATE,
    });
  }

  // ——— Warnings and cautions
  content.push(heading('Warnings and cautions', accent, true));
  const warnings = [
    ...r.warnings.map((w) => studyWarningText(w, units)),
    ...(design?.warnings ?? []).map((w) => studyWarningText(w, units)),
  ];
  if (warnings.length) {
    content.push({ text: 'What this study flags', style: 'h2', color: accent });
    content.push({ ul: warnings.map((w) => cite(w, refs)), margin: [0, 0, 0, 8] });
  }
  content.push({ text: 'Cautions', style: 'h2', color: accent });
  content.push({ ul: studyCautions(units), margin: [0, 0, 0, 8] });

  // ——— Relations and references
  const relations = (design?.sources ?? []).map((s) => cite(phraseMessage(s, units), refs));
  if (design) refs.add(design.source);
  if (relations.length) {
    content.push({ text: 'Relations used', style: 'h2', color: accent });
    content.push({ ul: relations, fontSize: 8.5, margin: [0, 0, 0, 6] });
  }
  content.push({ text: 'References: the published methods used', style: 'h2', color: accent });
  content.push({ ol: referenceList(refs), fontSize: 8.5 });

  // ——— Prepared by / reviewed by
  const approved = review.state === 'approved';
  content.push(heading('Prepared by and reviewed by', accent, true));
  content.push({
    columns: [
      {
        stack: [
          { text: 'Prepared by', style: 'h2', color: accent },
          { text: version.issuedByName, bold: true },
          { text: firm.name },
          { text: `Version ${version.number} issued ${stamp(version.issuedAt)}` },
          ...(firm.sealStatement
            ? [{ text: firm.sealStatement, italics: true, margin: [0, 6, 0, 0] }]
            : []),
        ],
      },
      {
        stack: approved
          ? [
              { text: 'Reviewed by', style: 'h2', color: accent },
              { text: review.reviewedByName ?? '—', bold: true },
              { text: `Licence ${review.licence ?? '—'}, ${review.jurisdiction ?? '—'}` },
              { text: `Approved ${review.reviewedAt ? stamp(review.reviewedAt) : '—'}` },
              ...(review.statement
                ? [{ text: review.statement, italics: true, margin: [0, 6, 0, 0] }]
                : []),
            ]
          : [
              { text: 'Reviewed by', style: 'h2', color: accent },
              { text: 'NOT REVIEWED', bold: true, fontSize: 14, color: '#b42318' },
              { text: REVIEW_WORDS[review.state] },
              { text: 'No licensed engineer has approved this version.' },
            ],
      },
    ],
    columnGap: 24,
  });

  const pageCount = { value: 0 };
  const footerText = brand?.footer ?? null;
  const definition: Record<string, unknown> = {
    pageSize: 'A4',
    pageMargins: [40, 48, 40, 56],
    info: {
      title: `${project.name} — concept proposal, version ${version.number}`,
      author: firm.name,
      subject: 'Energy dissipator concept design proposal',
      creator: 'Basinwright',
    },
    ...(brand
      ? {}
      : {
          watermark: {
            text: CONCEPT_WATERMARK,
            color: '#94a3b8',
            opacity: 0.18,
            bold: true,
            fontSize: 72,
          },
        }),
    defaultStyle: { font: 'Lato', fontSize: 9.5, lineHeight: 1.2, color: '#0f172a' },
    styles: {
      title: { fontSize: 22, bold: true },
      subtitle: { fontSize: 15, margin: [0, 0, 0, 18], color: SLATE },
      firm: { fontSize: 16, bold: true },
      h1: { fontSize: 15, bold: true, margin: [0, 0, 0, 8] },
      h2: { fontSize: 11, bold: true, margin: [0, 10, 0, 4] },
      th: { bold: true, color: SLATE, fontSize: 8 },
    },
    footer: (currentPage: number, count: number) => {
      pageCount.value = Math.max(pageCount.value, count);
      return {
        columns: [
          {
            text: `${firm.name} · ${project.name} · version ${version.number}${footerText ? ` · ${footerText}` : ''}`,
            fontSize: 7.5,
            color: MUTED,
          },
          {
            text: `Page ${currentPage} of ${count}`,
            alignment: 'right',
            fontSize: 7.5,
            color: MUTED,
            width: 80,
          },
        ],
        margin: [40, 20, 40, 0],
      };
    },
    content,
  };
  return { definition, pageCount };
}
