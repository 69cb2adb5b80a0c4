import type { Request, Response } from 'express';
import { LOGO_LIMITS, type BrandUpdateInput } from '@basinwright/common';
import { validationError } from '../../errors';
import { Firm } from '../../models';
import { authOf } from '../../middlewares/auth';
import { presentBrand } from './brand.presenter';
import * as brand from './brand.service';

async function freshFirm(id: string): Promise<Firm> {
  return Firm.findByPk(id, { rejectOnEmpty: true });
}

export async function read(req: Request, res: Response): Promise<void> {
  res.json(presentBrand(await freshFirm(authOf(req).firm.id)));
}

export async function update(req: Request, res: Response): Promise<void> {
  res.json(
    presentBrand(await brand.updateBrand(authOf(req).firm.id, req.body as BrandUpdateInput)),
  );
}

export async function uploadLogo(req: Request, res: Response): Promise<void> {
  const file = req.file;
  if (file === undefined)
    throw validationError({ logo: 'Choose a PNG or JPEG file.' }, 'Choose a PNG or JPEG file.');
  res.json(
    presentBrand(await brand.storeLogo(authOf(req).firm.id, file.buffer, file.originalname)),
  );
}

export async function removeLogo(req: Request, res: Response): Promise<void> {
  await brand.removeLogo(authOf(req).firm.id);
  res.status(204).end();
}

export async function readLogo(req: Request, res: Response): Promise<void> {
  const raw = req.query.size;
  const sizes: readonly number[] = LOGO_LIMITS.servedSizes;
  const size = raw === undefined ? 256 : Number(raw);
  if (typeof raw !== 'undefined' && (typeof raw !== 'string' || !sizes.includes(size)))
    throw validationError(
      { size: `Choose a size of ${sizes.join(', ')} pixels.` },
      `Choose a size of ${sizes.join(', ')} pixels.`,
    );
  const png = await brand.logoAtSize(authOf(req).firm.id, size);
  res.type('image/png').send(png);
}
