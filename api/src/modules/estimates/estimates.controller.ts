import type { Request, Response } from 'express';
import type {
  EstimateCreateInput,
  EstimateOverrideInput,
  EstimateUpdateInput,
  PriceExportQuery,
} from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { writeSheetCsv, writeSheetXlsx } from '../price-books/price-books.files';
import { exportFileName } from '@basinwright/common';
import * as estimates from './estimates.service';

type IdReq = Request<{ id: string }>;

export async function readTakeoff(req: IdReq, res: Response): Promise<void> {
  res.json(await estimates.readTakeoff(authOf(req).firm.id, req.params.id));
}

export async function saveTakeoffOverrides(req: IdReq, res: Response): Promise<void> {
  res.json(await estimates.saveTakeoffOverrides(authOf(req).user, req.params.id, req.body));
}

export async function list(req: IdReq, res: Response): Promise<void> {
  res.json({ items: await estimates.listEstimates(authOf(req).firm.id, req.params.id) });
}

export async function create(req: IdReq, res: Response): Promise<void> {
  const body = req.body as EstimateCreateInput;
  res.status(201).json(await estimates.createEstimate(authOf(req).user, req.params.id, body));
}

export async function read(req: IdReq, res: Response): Promise<void> {
  res.json(await estimates.readEstimate(authOf(req).firm.id, req.params.id));
}

export async function update(req: IdReq, res: Response): Promise<void> {
  const body = req.body as EstimateUpdateInput;
  res.json(await estimates.updateEstimate(authOf(req).firm.id, req.params.id, body));
}

export async function override(req: IdReq, res: Response): Promise<void> {
  const body = req.body as EstimateOverrideInput;
  res.json(await estimates.overrideQuantity(authOf(req).user, req.params.id, body));
}

export async function issue(req: IdReq, res: Response): Promise<void> {
  res.json(await estimates.issueEstimate(authOf(req).user, req.params.id));
}

export async function exportEstimate(req: IdReq, res: Response): Promise<void> {
  const { format } = res.locals.query as PriceExportQuery;
  const firmId = authOf(req).firm.id;
  const v = await estimates.readEstimate(firmId, req.params.id);
  const out = await estimates.estimateExport(firmId, v);
  res.setHeader('Content-Disposition', `attachment; filename="${out.stem}.${format}"`);
  if (format === 'xlsx') {
    res.setHeader(
      'Content-Type',
      'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    );
    res.send(await writeSheetXlsx(out.title, out.cells, out.headingRow));
    return;
  }
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.send(writeSheetCsv(out.cells));
}

/** GET /projects/:id/alternatives/export?format=csv|xlsx (Firm plan). */
export async function exportAlternatives(req: IdReq, res: Response): Promise<void> {
  const { format } = res.locals.query as PriceExportQuery;
  const auth = authOf(req);
  const out = await estimates.alternativesExport(auth.firm, req.params.id);
  const name = exportFileName([out.stem], format);
  res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
  if (format === 'xlsx') {
    res.setHeader(
      'Content-Type',
      'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    );
    res.send(await writeSheetXlsx(out.title, out.cells, out.headingRow));
    return;
  }
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.send(writeSheetCsv(out.cells));
}
