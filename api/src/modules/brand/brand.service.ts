import { LOGO_LIMITS, planAllows, type BrandUpdateInput, type Plan } from '@basinwright/common';
import sharp, { type Metadata } from 'sharp';
import { ApiError, notFound, payloadTooLarge } from '../../errors';
import { Firm, sequelize } from '../../models';

export type LogoType = 'image/png' | 'image/jpeg';

/** The brand a proposal prints; null on a plan without branded proposals (Concept). */
export interface FirmBrand {
  firmName: string;
  color: string | null;
  logo: { type: LogoType; data: Buffer } | null;
  footer: string | null;
  sealStatement: string | null;
}

/**
 * For the proposal helper: the firm's brand when its plan includes branded proposals, else
 * null (Concept proposals are unbranded and carry the watermark, see proposalWatermark).
 * Pass a firm loaded with its logo (Firm.findByPk): the signed-in context's firm has no logo bytes.
 */
export function brandFor(
  firm: Pick<
    Firm,
    'name' | 'plan' | 'brandColor' | 'logo' | 'logoType' | 'proposalFooter' | 'sealStatement'
  >,
): FirmBrand | null {
  if (!planAllows(firm.plan, 'brandedProposals')) return null;
  return {
    firmName: firm.name,
    color: firm.brandColor,
    logo:
      firm.logo !== null && firm.logoType !== null
        ? { type: firm.logoType, data: firm.logo }
        : null,
    footer: firm.proposalFooter,
    sealStatement: firm.sealStatement,
  };
}

/** The watermark a proposal carries on the plan ("Concept plan"), or null. */
export function proposalWatermark(plan: Plan): string | null {
  return planAllows(plan, 'brandedProposals') ? null : 'Concept plan';
}

export async function updateBrand(firmId: string, input: BrandUpdateInput): Promise<Firm> {
  const firm = await Firm.findByPk(firmId);
  if (firm === null) throw notFound();
  const changes: Partial<Pick<Firm, 'brandColor' | 'proposalFooter' | 'sealStatement'>> = {};
  if (input.color !== undefined)
    changes.brandColor = input.color === null ? null : input.color.toLowerCase();
  if (input.footer !== undefined) changes.proposalFooter = input.footer;
  if (input.sealStatement !== undefined) changes.sealStatement = input.sealStatement;
  await firm.update(changes);
  return firm;
}

const PNG_MAGIC = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const JPEG_MAGIC = Buffer.from([0xff, 0xd8, 0xff]);

/** The type a file's first bytes say it is: PNG or JPEG, else null (SVG, GIF, text …). */
export function sniffImageType(bytes: Buffer): LogoType | null {
  if (bytes.length >= PNG_MAGIC.length && bytes.subarray(0, PNG_MAGIC.length).equals(PNG_MAGIC))
    return 'image/png';
  if (bytes.length >= JPEG_MAGIC.length && bytes.subarray(0, JPEG_MAGIC.length).equals(JPEG_MAGIC))
    return 'image/jpeg';
  return null;
}

const unsupportedImage = (message: string) => new ApiError(415, 'unsupported_media_type', message);
const badImage = (message: string) =>
  new ApiError(422, 'validation_error', message, { logo: message });

/**
 * Checks an uploaded logo by its content (never its name or declared type): PNG or JPEG by its
 * magic bytes, at most 1 MB, dimensions read from the header within 4000 × 4000 before any
 * pixel is decoded; then re-encodes it (PNG, fitting 1024 px) so what is stored is our own file.
 */
export async function checkedLogo(
  bytes: Buffer,
  fileName = '',
): Promise<{ type: LogoType; data: Buffer }> {
  if (bytes.length === 0) throw badImage('The file is empty. Choose a PNG or JPEG logo.');
  if (bytes.length > LOGO_LIMITS.maxBytes) throw payloadTooLarge('The logo is larger than 1 MB.');
  const type = sniffImageType(bytes);
  if (type === null)
    throw unsupportedImage(
      'The logo must be a PNG or JPEG image (checked by its content; SVG and other formats are not accepted).',
    );
  // The content decides the type; a name that claims the other type is refused rather than
  // guessed (a PNG renamed .jpg is usually a mistake the user should see).
  const extension = /\.([a-z0-9]+)$/i.exec(fileName)?.[1]?.toLowerCase();
  const named =
    extension === 'png'
      ? 'image/png'
      : extension === 'jpg' || extension === 'jpeg'
        ? 'image/jpeg'
        : null;
  if (named !== null && named !== type) {
    const is = type === 'image/png' ? 'a PNG' : 'a JPEG';
    throw badImage(
      `This file is ${is} image but its name ends in .${extension}. Rename it to .${type === 'image/png' ? 'png' : 'jpg'} and upload it again.`,
    );
  }
  let meta: Metadata;
  try {
    meta = await sharp(bytes, { limitInputPixels: false }).metadata();
  } catch {
    throw badImage('The file could not be read as an image. Choose another PNG or JPEG.');
  }
  const expected = type === 'image/png' ? 'png' : 'jpeg';
  if (meta.format !== expected)
    throw unsupportedImage('The logo must be a PNG or JPEG image (checked by its content).');
  const { width, height } = meta;
  if (width === undefined || height === undefined || width < 1 || height < 1)
    throw badImage('The image has no readable size. Choose another PNG or JPEG.');
  if (width > LOGO_LIMITS.maxWidth || height > LOGO_LIMITS.maxHeight)
    throw badImage(
      `The logo is ${width} × ${height} pixels; it may be at most ${LOGO_LIMITS.maxWidth} × ${LOGO_LIMITS.maxHeight}.`,
    );
  try {
    const data = await sharp(bytes, {
      limitInputPixels: LOGO_LIMITS.maxWidth * LOGO_LIMITS.maxHeight,
    })
      .rotate()
      .resize({
        width: LOGO_LIMITS.storedMaxSide,
        height: LOGO_LIMITS.storedMaxSide,
        fit: 'inside',
        withoutEnlargement: true,
      })
      .png()
      .toBuffer();
    return { type: 'image/png', data };
  } catch {
    throw badImage('The image could not be decoded. Choose another PNG or JPEG.');
  }
}

export async function storeLogo(firmId: string, bytes: Buffer, fileName = ''): Promise<Firm> {
  const logo = await checkedLogo(bytes, fileName);
  return sequelize.transaction(async (transaction) => {
    const firm = await Firm.findByPk(firmId, { transaction, lock: transaction.LOCK.UPDATE });
    if (firm === null) throw notFound();
    await firm.update(
      { logo: logo.data, logoType: logo.type, logoUpdatedAt: new Date() },
      { transaction },
    );
    return firm;
  });
}

export async function removeLogo(firmId: string): Promise<void> {
  const [count] = await Firm.update(
    { logo: null, logoType: null, logoUpdatedAt: null },
    { where: { id: firmId } },
  );
  if (count === 0) throw notFound();
}

/** The stored logo resized so its longer side is `size` px (never enlarged), as PNG. */
export async function logoAtSize(firmId: string, size: number): Promise<Buffer> {
  const firm = await Firm.findByPk(firmId, { attributes: ['id', 'logo'] });
  if (firm === null || firm.logo === null) throw notFound('The firm has no logo.');
  return sharp(firm.logo)
    .resize({ width: size, height: size, fit: 'inside', withoutEnlargement: true })
    .png()
    .toBuffer();
}
