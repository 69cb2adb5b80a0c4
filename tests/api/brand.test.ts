// The firm's brand (issue 10): colour checked for contrast against white text, footer and seal
// statement, and the logo checked by its content (PNG or JPEG magic bytes, ≤ 1 MB, ≤ 4000 × 4000
// pixels read from the header, SVG refused), stored re-encoded and served back resized.
import { crc32 } from 'node:zlib';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { bearer, setPlan, signUpFirm, apiForFile, addMember } from '../support/api-app';

const h = apiForFile();

/** A real image made here with sharp (an independent encoder), `width` × `height` pixels. */
function image(width: number, height: number, format: 'png' | 'jpeg') {
  const base = sharp({
    create: { width, height, channels: 3, background: { r: 15, g: 110, b: 110 } },
  });
  return (format === 'png' ? base.png() : base.jpeg()).toBuffer();
}

/** A small PNG whose header (IHDR, CRC recomputed) claims `width` × `height` pixels. */
async function pngClaiming(width: number, height: number): Promise<Buffer> {
  const png = Buffer.from(await image(8, 8, 'png'));
  // PNG layout (PNG specification §5): 8-byte signature, then IHDR: length (4), type (4) at 12,
  // width at 16, height at 20, … 13 data bytes, CRC over type + data at 29.
  png.writeUInt32BE(width, 16);
  png.writeUInt32BE(height, 20);
  png.writeUInt32BE(crc32(png.subarray(12, 29)), 29);
  return png;
}

const upload = (token: string, bytes: Buffer, filename: string, contentType: string) =>
  h
    .http()
    .put('/api/v1/firm/brand/logo')
    .set(bearer(token))
    .attach('logo', bytes, { filename, contentType });

async function storedLogo(firmId: string) {
  const firm = await h.models.Firm.findByPk(firmId);
  return { logo: firm?.logo ?? null, type: firm?.logoType ?? null };
}

describe('brand colour, footer and seal statement', () => {
  it('saves a colour with enough contrast and the texts; GET shows them', async () => {
    const firm = await signUpFirm(h, 'brand-colour');
    const res = await h.http().put('/api/v1/firm/brand').set(bearer(firm.token)).send({
      color: '#0F6E6E',
      footer: '  Harrowdale office  ',
      sealStatement: 'Sealed by a licensed engineer',
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      color: '#0f6e6e',
      footer: 'Harrowdale office',
      sealStatement: 'Sealed by a licensed engineer',
      plan: 'concept',
      onProposals: false,
      logo: null,
    });
    const read = await h.http().get('/api/v1/firm/brand').set(bearer(firm.token));
    expect(read.body.color).toBe('#0f6e6e');
    await setPlan(h, firm.firm.id, 'professional', 1);
    expect(
      (await h.http().get('/api/v1/firm/brand').set(bearer(firm.token))).body.onProposals,
    ).toBe(true);
  });

  it('refuses a colour too light for white text, quoting the ratio; #767676 is the lightest grey that passes', async () => {
    const firm = await signUpFirm(h, 'brand-contrast');
    // WCAG 2.x contrast of white on #777777 is 4.48:1 and on #767676 4.54:1 (widely published
    // pair: #767676 is the lightest grey meeting 4.5:1 on white).
    const light = await h
      .http()
      .put('/api/v1/firm/brand')
      .set(bearer(firm.token))
      .send({ color: '#777777' });
    expect(light.status).toBe(422);
    expect(light.body.details.color).toContain('4.47:1');
    expect(light.body.details.color).toContain('4.5:1');
    expect((await h.models.Firm.findByPk(firm.firm.id))?.brandColor).toBeNull();
    const ok = await h
      .http()
      .put('/api/v1/firm/brand')
      .set(bearer(firm.token))
      .send({ color: '#767676' });
    expect(ok.status).toBe(200);
    const bad = await h
      .http()
      .put('/api/v1/firm/brand')
      .set(bearer(firm.token))
      .send({ color: 'teal', footer: 'x'.repeat(501) });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.details).sort()).toEqual(['color', 'footer']);
  });
});

describe('logo upload', () => {
  it('stores a PNG re-encoded and serves it resized; any member can read it; removing it works', async () => {
    const firm = await signUpFirm(h, 'brand-logo');
    const res = await upload(firm.token, await image(800, 400, 'png'), 'logo.png', 'image/png');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.logo).not.toBeNull();
    const stored = await storedLogo(firm.firm.id);
    expect(stored.type).toBe('image/png');
    const viewer = await addMember(h, firm.firm.id, 'viewer');
    const served = await h
      .http()
      .get('/api/v1/firm/brand/logo?size=128')
      .set(bearer(viewer.token))
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(served.status).toBe(200);
    expect(served.headers['content-type']).toContain('image/png');
    const meta = await sharp(served.body as Buffer).metadata();
    // 800 × 400 fitted inside 128 × 128 keeps the 2:1 aspect: 128 × 64.
    expect([meta.width, meta.height]).toEqual([128, 64]);
    const badSize = await h
      .http()
      .get('/api/v1/firm/brand/logo?size=5000')
      .set(bearer(viewer.token));
    expect(badSize.status).toBe(422);
    expect((await h.http().delete('/api/v1/firm/brand/logo').set(bearer(firm.token))).status).toBe(
      204,
    );
    expect((await storedLogo(firm.firm.id)).logo).toBeNull();
    expect((await h.http().get('/api/v1/firm/brand/logo').set(bearer(viewer.token))).status).toBe(
      404,
    );
  });

  it('accepts a JPEG', async () => {
    const firm = await signUpFirm(h, 'brand-jpeg');
    const res = await upload(firm.token, await image(300, 300, 'jpeg'), 'logo.jpg', 'image/jpeg');
    expect(res.status).toBe(200);
    expect((await storedLogo(firm.firm.id)).logo).not.toBeNull();
  });

  const refusals: [string, () => Promise<[Buffer, string, string]>, number][] = [
    [
      'text named logo.png and declared image/png (wrong type by content)',
      async () => [Buffer.from('this is not an image at all'), 'logo.png', 'image/png'],
      415,
    ],
    [
      'a PNG renamed .jpg',
      async () => [await image(100, 100, 'png'), 'logo.jpg', 'image/jpeg'],
      422,
    ],
    [
      'more than 1 MB',
      async () => {
        const png = await image(10, 10, 'png');
        return [
          Buffer.concat([png, Buffer.alloc(1024 * 1024 + 1 - png.length)]),
          'big.png',
          'image/png',
        ];
      },
      413,
    ],
    [
      'huge pixel dimensions (4001 × 1, a few hundred bytes)',
      async () => [await image(4001, 1, 'png'), 'wide.png', 'image/png'],
      422,
    ],
    [
      'a header claiming 60000 × 60000 pixels',
      async () => [await pngClaiming(60000, 60000), 'bomb.png', 'image/png'],
      422,
    ],
    [
      'an SVG',
      async () => [
        Buffer.from(
          '<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>',
        ),
        'logo.svg',
        'image/svg+xml',
      ],
      415,
    ],
    [
      'an SVG declared image/png',
      async () => [
        Buffer.from('<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg"/>'),
        'logo.png',
        'image/png',
      ],
      415,
    ],
  ];

  it.each(refusals)('refuses %s with a 4xx and stores nothing', async (_name, make, status) => {
    const firm = await signUpFirm(h, 'brand-refuse');
    const [bytes, filename, type] = await make();
    const res = await upload(firm.token, bytes, filename, type);
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    expect(typeof res.body.message).toBe('string');
    expect(await storedLogo(firm.firm.id)).toEqual({ logo: null, type: null });
  });

  it('refuses a body that is not multipart, and a missing file', async () => {
    const firm = await signUpFirm(h, 'brand-shape');
    const json = await h
      .http()
      .put('/api/v1/firm/brand/logo')
      .set(bearer(firm.token))
      .send({ logo: 'x' });
    expect(json.status).toBe(415);
    const empty = await h
      .http()
      .put('/api/v1/firm/brand/logo')
      .set(bearer(firm.token))
      .field('other', 'x');
    expect(empty.status).toBeGreaterThanOrEqual(400);
    expect(empty.status).toBeLessThan(500);
  });
});

describe('the brand belongs to one firm (cross-firm probes)', () => {
  it('a firm sees and changes only its own brand and logo', async () => {
    const a = await signUpFirm(h, 'brand-a');
    const b = await signUpFirm(h, 'brand-b');
    await upload(a.token, await image(64, 64, 'png'), 'a.png', 'image/png');
    await h.http().put('/api/v1/firm/brand').set(bearer(a.token)).send({ footer: 'A only' });
    expect((await h.http().get('/api/v1/firm/brand/logo').set(bearer(b.token))).status).toBe(404);
    const bBrand = await h.http().get('/api/v1/firm/brand').set(bearer(b.token));
    expect(bBrand.body).toMatchObject({ footer: null, logo: null });
    expect((await h.http().delete('/api/v1/firm/brand/logo').set(bearer(b.token))).status).toBe(
      204,
    );
    expect((await storedLogo(a.firm.id)).logo).not.toBeNull();
  });
});
