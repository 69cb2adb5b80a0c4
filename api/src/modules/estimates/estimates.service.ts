import {
  compareAlternatives,
  exportHeader,
  neutralise,
  sheetRows,
  toDecimals,
  type ExportTable,
  type SheetCell,
  type TypeMeasures,
  DEFAULT_ESTIMATE_SETTINGS,
  ENGINE_VERSION,
  ESTIMATE_STEPS,
  PRICE_UNITS,
  estimate,
  priceUnitOf,
  quantityInUnit,
  takeoff,
  takeoffOverridesSchema,
  takeoffOverridesToSI,
  type EstimateLineInput,
  type EstimateOverrideInput,
  type EstimateResult,
  type EstimateSettings,
  type EstimateUpdateInput,
  type Takeoff,
  type TakeoffOverrides,
  type TakeoffQuantityKind,
} from '@basinwright/common';
import { ValidationError } from 'yup';
import type { Transaction } from 'sequelize';
import { conflict, fromEngineError, notFound, validationError } from '../../errors';
import { requireFeature } from '../plans/plans.service';
import {
  Design,
  DesignTakeoff,
  Estimate,
  EstimateAuditEntry,
  PriceBook,
  PriceBookItem,
  Project,
  sequelize,
  type User,
} from '../../models';
import type { PricedFrom } from '../../models/Estimate';
import { detailsOf } from '../../middlewares/validate';
import { isUuid } from '../../security';
import { getProject } from '../projects/projects.service';

const NOT_FOUND = 'No such estimate.';
const ISSUED =
  'This revision is issued and cannot change. Start a new revision from it to make changes.';

/** SI unit labels of the take-off's quantity kinds. */
export const SI_UNIT: Record<TakeoffQuantityKind, string> = {
  earthwork: 'm³',
  mass: 'kg',
  area: 'm²',
  length: 'm',
};

export interface TakeoffLineView {
  key: string;
  kind: string;
  element: string;
  quantityKind: TakeoffQuantityKind;
  /** SI (m³, kg, m², m) */
  quantity: number;
  unit: string;
  basis: string;
}

export interface PricedLineView {
  key: string;
  code: string;
  description: string;
  unit: string;
  unitPrice: number;
  currency: string;
  /** the take-off's quantity in the price's unit */
  quantity: number;
  /** the quantity priced (the override's when there is one) */
  quantityUsed: number;
  override: { quantity: number; reason: string } | null;
  amount: number;
}

export interface EstimateView {
  id: string;
  projectId: string;
  revision: number;
  status: 'draft' | 'issued';
  priceBook: { id: string; name: string; currency: string } | null;
  settings: EstimateSettings;
  /** take-off line key → item code, as remembered by the price book */
  mapping: Record<string, string>;
  takeoffLines: TakeoffLineView[];
  lines: PricedLineView[];
  /** take-off lines left out of the total, and why */
  unpriced: { key: string; reason: string }[];
  totals: Omit<EstimateResult, 'lines' | 'steps'> | null;
  steps: readonly string[];
  /** null while the design has no stored result */
  pricedFrom: Omit<PricedFrom, 'priceBookId' | 'priceBookName'> | null;
  /** the stored result was computed by an earlier engine */
  stale: boolean;
  /** why nothing could be priced (no stored result, no chosen basin) */
  problem: string | null;
  issuedAt: string | null;
  issuedBy: string | null;
  createdAt: string;
  audit: AuditView[];
}

export interface AuditView {
  at: string;
  by: string;
  key: string;
  oldQuantity: number | null;
  newQuantity: number | null;
  unit: string;
  reason: string;
}

/** The design of a project (locked inside a transaction when given one). */
async function designOf(firmId: string, projectId: string, transaction?: Transaction) {
  return Design.findOne({ where: { firmId, projectId }, transaction });
}

async function overridesOf(
  firmId: string,
  designId: string,
  transaction?: Transaction,
): Promise<TakeoffOverrides> {
  const row = await DesignTakeoff.findOne({ where: { firmId, designId }, transaction });
  return (row?.overrides ?? {}) as TakeoffOverrides;
}

/** The take-off of the project's stored design result, or why there is none. */
async function takeoffOf(
  firmId: string,
  projectId: string,
  transaction?: Transaction,
): Promise<{ design: Design | null; takeoff: Takeoff | null; problem: string | null }> {
  const design = await designOf(firmId, projectId, transaction);
  if (design === null)
    return { design, takeoff: null, problem: 'This project has no saved design yet.' };
  if (design.result === null || design.result === undefined)
    return {
      design,
      takeoff: null,
      problem: 'The design has no stored result. Open the design and save it.',
    };
  if (design.result.design === null)
    return { design, takeoff: null, problem: 'The design has no chosen basin to take off.' };
  const overrides = await overridesOf(firmId, design.id, transaction);
  try {
    return { design, takeoff: takeoff(design.result.design, overrides), problem: null };
  } catch (error) {
    throw fromEngineError(error, 'overrides');
  }
}

function takeoffLines(t: Takeoff | null): TakeoffLineView[] {
  return (t?.lines ?? []).map((line) => ({
    key: line.key,
    kind: line.kind,
    element: line.element,
    quantityKind: line.quantityKind,
    quantity: line.quantity,
    unit: SI_UNIT[line.quantityKind],
    basis: line.basis,
  }));
}

/** GET /projects/:id/takeoff: the lines, totals and assumptions of the stored design. */
export async function readTakeoff(firmId: string, projectId: string) {
  const project = await getProject(firmId, projectId);
  const { design, takeoff: t, problem } = await takeoffOf(firmId, projectId);
  return {
    projectId,
    units: project.units,
    problem,
    stale: design?.engineVersion !== undefined && design?.engineVersion !== ENGINE_VERSION,
    type: t?.type ?? null,
    lines: takeoffLines(t),
    totals: t?.totals ?? null,
    assumptions: t?.assumptions ?? [],
    soil: t?.soil ?? null,
    notes: t?.notes ?? [],
    overrides: design === null ? {} : await overridesOf(firmId, design.id),
  };
}

/** PUT /projects/:id/takeoff/overrides: the whole set, in the project's units (stored SI). */
export async function saveTakeoffOverrides(actor: User, projectId: string, body: unknown) {
  const project = await getProject(actor.firmId, projectId);
  const design = await designOf(actor.firmId, projectId);
  if (design === null)
    throw conflict('This project has no saved design yet: save the design first.');
  const raw = (body as { overrides?: unknown } | undefined)?.overrides ?? {};
  let checked: TakeoffOverrides;
  try {
    checked = takeoffOverridesSchema(project.units).validateSync(raw, { abortEarly: false });
  } catch (error) {
    if (error instanceof TypeError) throw validationError({ overrides: 'Send an object.' });
    if (!(error instanceof ValidationError)) throw error;
    const details = Object.fromEntries(
      Object.entries(detailsOf(error, 'body')).map(([k, v]) => [
        k === 'body' ? 'overrides' : `overrides.${k}`,
        v,
      ]),
    );
    throw validationError(details, Object.values(details)[0]);
  }
  const si = takeoffOverridesToSI(checked, project.units);
  const existing = await DesignTakeoff.findOne({
    where: { firmId: actor.firmId, designId: design.id },
  });
  if (existing === null)
    await DesignTakeoff.create({
      firmId: actor.firmId,
      designId: design.id,
      overrides: si as Record<string, unknown>,
      updatedById: actor.id,
    });
  else await existing.update({ overrides: si as Record<string, unknown>, updatedById: actor.id });
  return readTakeoff(actor.firmId, projectId);
}

/** The estimate of the firm (another firm's id is answered like a missing one). */
async function findEstimate(firmId: string, id: string, transaction?: Transaction) {
  if (!isUuid(id)) throw notFound(NOT_FOUND);
  const row = await Estimate.findOne({
    where: { id, firmId },
    transaction,
    lock: transaction === undefined ? undefined : transaction.LOCK.UPDATE,
  });
  if (row === null) throw notFound(NOT_FOUND);
  return row;
}

async function auditOf(firmId: string, estimateId: string): Promise<AuditView[]> {
  const rows = await EstimateAuditEntry.findAll({
    where: { firmId, estimateId },
    order: [
      ['createdAt', 'ASC'],
      ['id', 'ASC'],
    ],
  });
  return rows.map((r) => ({
    at: r.createdAt.toISOString(),
    by: r.userName,
    key: r.takeoffKey,
    oldQuantity: r.oldQuantity,
    newQuantity: r.newQuantity,
    unit: r.unit,
    reason: r.reason,
  }));
}

/** A draft priced now from the stored design result, the book and the overrides. */
async function priceDraft(row: Estimate, transaction?: Transaction): Promise<EstimateView> {
  const { design, takeoff: t, problem } = await takeoffOf(row.firmId, row.projectId, transaction);
  const book =
    row.priceBookId === null
      ? null
      : await PriceBook.findOne({
          where: { id: row.priceBookId, firmId: row.firmId },
          include: [{ model: PriceBookItem, as: 'items' }],
          transaction,
        });
  const mapping = book?.takeoffMapping ?? {};
  const items = new Map((book?.items ?? []).map((item) => [item.code.toLowerCase(), item]));
  const lines: PricedLineView[] = [];
  const inputs: EstimateLineInput[] = [];
  const unpriced: { key: string; reason: string }[] = [];
  for (const line of t?.lines ?? []) {
    const code = mapping[line.key];
    if (book === null) {
      unpriced.push({ key: line.key, reason: 'No price book chosen.' });
      continue;
    }
    if (code === undefined || code === '') {
      unpriced.push({ key: line.key, reason: 'No price-book item chosen for this line.' });
      continue;
    }
    const item = items.get(code.toLowerCase());
    if (item === undefined) {
      unpriced.push({ key: line.key, reason: `The price book has no item ${code}.` });
      continue;
    }
    const unit = priceUnitOf(item.unit);
    if (unit === null || PRICE_UNITS[unit].kind !== line.quantityKind) {
      unpriced.push({
        key: line.key,
        reason: `Item ${item.code} is priced per ${item.unit}, which does not measure this line (${SI_UNIT[line.quantityKind]}).`,
      });
      continue;
    }
    const quantity = quantityInUnit(line.quantity, line.quantityKind, unit);
    const ov = row.quantityOverrides[line.key];
    const override =
      ov === undefined
        ? undefined
        : { quantity: quantityInUnit(ov.quantity, line.quantityKind, unit), reason: ov.reason };
    const unitPrice = Number(item.unitPrice);
    inputs.push({
      key: line.key,
      description: item.description,
      quantity,
      unit,
      unitPrice,
      ...(override === undefined ? {} : { override }),
    });
    lines.push({
      key: line.key,
      code: item.code,
      description: item.description,
      unit: PRICE_UNITS[unit].label,
      unitPrice,
      currency: item.currency,
      quantity,
      quantityUsed: override?.quantity ?? quantity,
      override: override ?? null,
      amount: 0,
    });
  }
  let totals: EstimateView['totals'] = null;
  if (t !== null && book !== null) {
    let result: EstimateResult;
    try {
      result = estimate({ lines: inputs, ...row.settings });
    } catch (error) {
      throw fromEngineError(error, 'settings');
    }
    result.lines.forEach((priced, i) => {
      const view = lines[i];
      if (view !== undefined) view.amount = priced.amount;
    });
    totals = {
      direct: result.direct,
      located: result.located,
      mobilisation: result.mobilisation,
      careOfWater: result.careOfWater,
      contingency: result.contingency,
      overheadAndProfit: result.overheadAndProfit,
      escalation: result.escalation,
      total: result.total,
      accuracy: result.accuracy,
    };
  }
  return {
    id: row.id,
    projectId: row.projectId,
    revision: row.revision,
    status: row.status,
    priceBook: book === null ? null : { id: book.id, name: book.name, currency: book.currency },
    settings: row.settings,
    mapping,
    takeoffLines: takeoffLines(t),
    lines,
    unpriced,
    totals,
    steps: ESTIMATE_STEPS,
    pricedFrom:
      design === null || t === null
        ? null
        : {
            designId: design.id,
            engineVersion: design.engineVersion,
            computedAt: design.computedAt?.toISOString() ?? null,
            designUpdatedAt: design.updatedAt.toISOString(),
          },
    stale: design !== null && t !== null && design.engineVersion !== ENGINE_VERSION,
    problem,
    issuedAt: null,
    issuedBy: null,
    createdAt: row.createdAt.toISOString(),
    audit: [],
  };
}

/** The revision as the API shows it: an issued one exactly as it was issued. */
async function view(row: Estimate): Promise<EstimateView> {
  const audit = await auditOf(row.firmId, row.id);
  if (row.status === 'issued' && row.issuedSnapshot !== null && row.issuedSnapshot !== undefined)
    return { ...(row.issuedSnapshot as unknown as EstimateView), audit };
  return { ...(await priceDraft(row)), audit };
}

export async function listEstimates(firmId: string, projectId: string) {
  await getProject(firmId, projectId);
  const rows = await Estimate.findAll({
    where: { firmId, projectId },
    order: [['revision', 'DESC']],
  });
  return rows.map((row) => ({
    id: row.id,
    revision: row.revision,
    status: row.status,
    issuedAt: row.issuedAt?.toISOString() ?? null,
    total:
      row.status === 'issued'
        ? ((row.issuedSnapshot as { totals?: { total?: number } | null } | null)?.totals?.total ??
          null)
        : null,
    createdAt: row.createdAt.toISOString(),
  }));
}

export async function readEstimate(firmId: string, id: string): Promise<EstimateView> {
  return view(await findEstimate(firmId, id));
}

/**
 * A new revision: the first starts empty (class 5, no additions), a later one starts from the
 * latest issued revision (book, settings, quantity overrides). A draft in progress is the one
 * to change: a second draft is a 409.
 */
export async function createEstimate(
  actor: User,
  projectId: string,
  body: { priceBookId?: string | null },
): Promise<EstimateView> {
  await getProject(actor.firmId, projectId);
  const id = await sequelize.transaction(async (transaction) => {
    await Project.findOne({
      where: { id: projectId, firmId: actor.firmId },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    const latest = await Estimate.findOne({
      where: { firmId: actor.firmId, projectId },
      order: [['revision', 'DESC']],
      transaction,
    });
    if (latest?.status === 'draft')
      throw conflict(
        `Revision ${latest.revision} is still a draft: change it, or issue it before starting another.`,
      );
    let priceBookId = latest?.priceBookId ?? null;
    if (body.priceBookId !== undefined && body.priceBookId !== null) {
      await bookOf(actor.firmId, body.priceBookId, transaction);
      priceBookId = body.priceBookId;
    }
    const row = await Estimate.create(
      {
        firmId: actor.firmId,
        projectId,
        revision: (latest?.revision ?? 0) + 1,
        priceBookId,
        settings: latest?.settings ?? DEFAULT_ESTIMATE_SETTINGS,
        quantityOverrides: latest?.quantityOverrides ?? {},
        createdById: actor.id,
      },
      { transaction },
    );
    return row.id;
  });
  return readEstimate(actor.firmId, id);
}

async function bookOf(firmId: string, id: string, transaction: Transaction) {
  const book = isUuid(id)
    ? await PriceBook.findOne({ where: { id, firmId }, transaction, lock: transaction.LOCK.UPDATE })
    : null;
  if (book === null) throw validationError({ priceBookId: 'No such price book.' });
  return book;
}

/** Chooses the book, changes settings, or maps take-off lines to the book's codes (remembered by the book). */
export async function updateEstimate(
  firmId: string,
  id: string,
  input: EstimateUpdateInput,
): Promise<EstimateView> {
  await sequelize.transaction(async (transaction) => {
    const row = await findEstimate(firmId, id, transaction);
    if (row.status === 'issued') throw conflict(ISSUED);
    const changes: Partial<Pick<Estimate, 'priceBookId' | 'settings'>> = {};
    if (input.priceBookId !== undefined) {
      if (input.priceBookId !== null) {
        const book = await bookOf(firmId, input.priceBookId, transaction);
        if (book.archivedAt !== null)
          throw validationError({ priceBookId: 'That price book is archived.' });
      }
      changes.priceBookId = input.priceBookId;
    }
    if (input.settings !== undefined) changes.settings = input.settings;
    await row.update(changes, { transaction });
    if (input.mapping !== undefined) {
      if (row.priceBookId === null)
        throw validationError({ mapping: 'Choose a price book before mapping lines to it.' });
      const book = await bookOf(firmId, row.priceBookId, transaction);
      const next = { ...book.takeoffMapping };
      for (const [key, code] of Object.entries(input.mapping)) {
        if (code === '') delete next[key];
        else next[key] = code;
      }
      await book.update({ takeoffMapping: next }, { transaction });
    }
  });
  return readEstimate(firmId, id);
}

/**
 * Sets (or, with quantity null, removes) a quantity override with its reason, and writes the
 * audit entry: who, when, the quantity before and after (SI) and why.
 */
export async function overrideQuantity(
  actor: User,
  id: string,
  input: EstimateOverrideInput,
): Promise<EstimateView> {
  await sequelize.transaction(async (transaction) => {
    const row = await findEstimate(actor.firmId, id, transaction);
    if (row.status === 'issued') throw conflict(ISSUED);
    const { takeoff: t, problem } = await takeoffOf(actor.firmId, row.projectId, transaction);
    if (t === null) throw conflict(problem ?? 'There is no take-off to change.');
    const line = t.lines.find((l) => l.key === input.key);
    if (line === undefined)
      throw validationError({ key: `The take-off has no line ${input.key}.` });
    let si: number | null = null;
    if (input.quantity !== null) {
      const unit = input.unit;
      if (unit !== undefined && PRICE_UNITS[unit].kind !== line.quantityKind)
        throw validationError({
          unit: `This line is measured in ${SI_UNIT[line.quantityKind]}; ${PRICE_UNITS[unit].label} does not measure it.`,
        });
      si =
        unit === undefined
          ? input.quantity
          : input.quantity / quantityInUnit(1, line.quantityKind, unit);
    }
    const previous = row.quantityOverrides[line.key];
    const next = { ...row.quantityOverrides };
    if (si === null) delete next[line.key];
    else next[line.key] = { quantity: si, reason: input.reason };
    await row.update({ quantityOverrides: next }, { transaction });
    await EstimateAuditEntry.create(
      {
        firmId: actor.firmId,
        estimateId: row.id,
        userId: actor.id,
        userName: actor.name,
        takeoffKey: line.key,
        oldQuantity: previous?.quantity ?? line.quantity,
        newQuantity: si ?? line.quantity,
        unit: SI_UNIT[line.quantityKind],
        reason: input.reason,
      },
      { transaction },
    );
  });
  return readEstimate(actor.firmId, id);
}

/**
 * Issues the draft: its lines and totals are frozen with what they were priced from (the
 * design, its stored result's engine version and time, the book); from now on every change is
 * a 409. Refused while nothing can be priced.
 */
export async function issueEstimate(actor: User, id: string): Promise<EstimateView> {
  await sequelize.transaction(async (transaction) => {
    const row = await findEstimate(actor.firmId, id, transaction);
    if (row.status === 'issued') throw conflict(ISSUED);
    const priced = await priceDraft(row, transaction);
    if (priced.problem !== null) throw conflict(priced.problem);
    if (priced.priceBook === null || priced.totals === null)
      throw conflict('Choose a price book before issuing.');
    if (priced.lines.length === 0)
      throw conflict('No take-off line is priced yet: map the lines to price-book items first.');
    const issuedAt = new Date();
    const snapshot: EstimateView = {
      ...priced,
      status: 'issued',
      issuedAt: issuedAt.toISOString(),
      issuedBy: actor.name,
      audit: [],
    };
    await row.update(
      {
        status: 'issued',
        issuedAt,
        issuedById: actor.id,
        issuedSnapshot: snapshot as unknown as Record<string, unknown>,
        pricedFrom:
          priced.pricedFrom === null
            ? null
            : {
                ...priced.pricedFrom,
                priceBookId: priced.priceBook.id,
                priceBookName: priced.priceBook.name,
              },
      },
      { transaction },
    );
  });
  return readEstimate(actor.firmId, id);
}

/** The estimate as rows for a CSV or XLSX download (text neutralised by the writer). */
export function exportTable(v: EstimateView): { header: string[]; rows: (string | number)[][] } {
  const header = [
    'Take-off line',
    'Code',
    'Description',
    'Quantity',
    'Unit',
    'Unit price',
    'Currency',
    'Amount',
    'Quantity changed because',
  ];
  // Quantities to 3 decimals and money to the cent, as an estimator reads them.
  const r3 = (x: number): number => toDecimals(x, 3);
  const r2 = (x: number): number => toDecimals(x, 2);
  const rows: (string | number)[][] = v.lines.map((l) => [
    l.key,
    l.code,
    l.description,
    r3(l.quantityUsed),
    l.unit,
    l.unitPrice,
    l.currency,
    r2(l.amount),
    l.override?.reason ?? '',
  ]);
  for (const u of v.unpriced) rows.push([u.key, '', u.reason, '', '', '', '', '', '']);
  const t = v.totals;
  if (t !== null) {
    const sum = (label: string, value: number) =>
      rows.push([label, '', '', '', '', '', '', r2(value), '']);
    rows.push([]);
    sum('Direct cost', t.direct);
    sum(`Located cost (× ${v.settings.locationFactor})`, t.located);
    sum('Mobilisation', t.mobilisation);
    sum('Care of water', t.careOfWater);
    sum('Contingency', t.contingency);
    sum('Overhead and profit', t.overheadAndProfit);
    sum('Escalation', t.escalation);
    sum('Total', t.total);
    sum(
      `Range low (class ${t.accuracy.aaceClass}, ${Math.round(t.accuracy.lowPct * 100)} %)`,
      t.accuracy.low,
    );
    sum(
      `Range high (class ${t.accuracy.aaceClass}, +${Math.round(t.accuracy.highPct * 100)} %)`,
      t.accuracy.high,
    );
  }
  rows.push([]);
  rows.push([
    `Revision ${v.revision} (${v.status})`,
    '',
    v.priceBook?.name ?? '',
    '',
    '',
    '',
    '',
    '',
    '',
  ]);
  if (v.pricedFrom !== null)
    rows.push([
      'Priced from design',
      v.pricedFrom.designId,
      `engine ${v.pricedFrom.engineVersion ?? '?'}, computed ${v.pricedFrom.computedAt ?? '?'}`,
      '',
      '',
      '',
      '',
      '',
      '',
    ]);
  return { header, rows };
}

/**
 * The estimate as a sheet: the header every export starts with (project, design, units, the
 * table, the caution), then the lines and totals of exportTable. The project's units name the
 * design's; quantities and prices are in the price book's own units and currency, per line.
 */
export async function estimateExport(
  firmId: string,
  v: EstimateView,
): Promise<{ title: string; cells: SheetCell[][]; headingRow: number; stem: string }> {
  const project = await getProject(firmId, v.projectId);
  const design = await designOf(firmId, v.projectId);
  const basin = design?.result?.design?.design.name ?? 'no basin sized';
  const { header, rows } = exportTable(v);
  const title = `Estimate revision ${v.revision} (${v.status})`;
  const top = exportHeader(
    {
      project: project.name,
      design: `${basin} (draft revision ${design?.revision ?? 0})`,
      units: project.units,
    },
    title,
    ['Quantities and prices in the price book’s units and currency, line by line.'],
  );
  const cell = (x: string | number): SheetCell => (typeof x === 'string' ? neutralise(x) : x);
  return {
    title,
    cells: [...top, header.map(cell), ...rows.map((r) => r.map(cell))],
    headingRow: top.length,
    stem: `estimate-revision-${v.revision}`,
  };
}

/** What an issued design version was computed from (its draft, engine and time). */
export interface VersionResultKey {
  designId: string;
  engineVersion: string;
  computedAt: Date;
}

/**
 * The project's issued revisions, newest first (read once, then matched to each version with
 * issuedEstimateFor).
 */
export async function issuedEstimates(firmId: string, projectId: string): Promise<Estimate[]> {
  return Estimate.findAll({
    where: { firmId, projectId, status: 'issued' },
    order: [['revision', 'DESC']],
  });
}

/**
 * The latest issued revision priced from exactly this version's design result: the same draft,
 * the same engine and the same computation time (a result is recomputed on every save, so the
 * time tells one result from another). Null when none was.
 */
export function issuedEstimateFor(
  estimates: Estimate[],
  version: VersionResultKey,
): EstimateView | null {
  const at = version.computedAt.getTime();
  for (const row of estimates) {
    const from = row.pricedFrom;
    if (row.status !== 'issued' || from === null || from === undefined) continue;
    if (from.designId !== version.designId || from.engineVersion !== version.engineVersion)
      continue;
    if (from.computedAt === null || new Date(from.computedAt).getTime() !== at) continue;
    const snapshot = row.issuedSnapshot as unknown as EstimateView | null;
    if (snapshot?.totals === null || snapshot?.totals === undefined) continue;
    return snapshot;
  }
  return null;
}

/** What the alternatives export needs of the firm: its id and plan. */
interface FirmPlan {
  id: string;
  plan: Parameters<typeof requireFeature>[0]['plan'];
}

/**
 * GET /projects/:id/alternatives/export: the sized types of the SAVED design side by side
 * (length, width, floor, excavation, concrete, reinforcement), in the project's units, as rows
 * of cells with the header naming the project, design and units. A Firm-plan feature: another
 * firm's project answers 404 first, then a plan without it answers 403 plan_limit.
 */
export async function alternativesExport(
  firm: FirmPlan,
  projectId: string,
): Promise<{ title: string; cells: SheetCell[][]; headingRow: number; stem: string }> {
  const project = await getProject(firm.id, projectId);
  requireFeature(firm, 'alternativesExport');
  const design = await designOf(firm.id, projectId);
  const result = design?.result ?? null;
  if (design === null || result === null)
    throw conflict('The design has no stored result to compare. Open the design and save it.');
  if (result.design === null)
    throw conflict('The saved design has no sized basin, so there is nothing to compare.');
  const overrides = await overridesOf(firm.id, design.id);
  let measures: TypeMeasures[];
  try {
    measures = compareAlternatives(result, {}, overrides);
  } catch (error) {
    throw fromEngineError(error, 'overrides');
  }
  const entries = [result.design, ...result.alternatives];
  const bed = result.input.channelBedElevation;
  type Row = TypeMeasures & { verdict: string; chosen: boolean };
  const rows: Row[] = measures.map((m, i) => ({
    ...m,
    verdict: entries[i]?.verdict ?? '',
    chosen: i === 0,
  }));
  const table: ExportTable<Row> = {
    title: 'Alternatives compared',
    notes: [
      'Each type on its own floor (a floor above the channel bed shows as a negative depth below it); quantities by neat lines from the take-off of the saved design (concrete with its waste allowance).',
    ],
    columns: [
      { title: 'Type', kind: null, value: (r) => r.name },
      { title: 'Chosen', kind: null, value: (r) => (r.chosen ? 'yes' : '') },
      { title: 'Screening', kind: null, value: (r) => r.verdict },
      { title: 'Floor elevation', kind: 'length', digits: 3, value: (r) => r.floorElevation },
      {
        title: 'Floor below the bed',
        kind: 'length',
        digits: 3,
        value: (r) => (r.floorElevation === null ? null : bed - r.floorElevation),
      },
      { title: 'Length', kind: 'length', digits: 3, value: (r) => r.length },
      { title: 'Width', kind: 'length', digits: 3, value: (r) => r.width },
      { title: 'Excavation', kind: 'earthwork', digits: 1, value: (r) => r.excavation },
      { title: 'Concrete', kind: 'earthwork', digits: 1, value: (r) => r.concrete },
      { title: 'Reinforcement', kind: 'mass', digits: 0, value: (r) => r.steel },
    ],
    rows,
  };
  const cells = sheetRows(table, {
    project: project.name,
    design: `${result.design.design.name} (draft revision ${design.revision ?? 0})`,
    units: project.units,
  });
  return {
    title: table.title,
    cells,
    headingRow: cells.length - rows.length - 1,
    stem: `alternatives-${project.name}`,
  };
}
