// The drawing's zoom and its PNG in a real browser (E2E_BASE_URL): jsdom has no canvas, so the
// PNG is made here, by Chromium, from the demo design's Sizing step — after a zoom, to show the
// file is the whole sheet, not the view. The file is read back by a PNG reader written here
// from the PNG specification [W3C PNG (Second Edition): signature, chunks, IHDR, IDAT zlib
// data, the five scanline filters], independent of the browser that wrote it.
import { readFile } from 'node:fs/promises';
import { inflateSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowser, type E2eBrowser, openDemoDesignStep, e2eBaseUrl } from '../support/e2e';
import { expectRel } from '../support/tolerance';

/** The PNG signature [PNG spec, 5.2]. */
const SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

interface Png {
  width: number;
  height: number;
  /** RGBA of pixel (x, y), 0…255 each */
  at(x: number, y: number): [number, number, number, number];
}

/** A non-interlaced 8-bit RGB or RGBA PNG, decoded [PNG spec, 11.2.2 IHDR; 9 filtering]. */
function readPng(bytes: Buffer): Png {
  expect([...bytes.subarray(0, 8)]).toEqual(SIGNATURE);
  let at = 8;
  let width = 0,
    height = 0,
    depth = 0,
    colour = 0,
    interlace = 0;
  const idat: Buffer[] = [];
  while (at < bytes.length) {
    const length = bytes.readUInt32BE(at);
    const type = bytes.toString('latin1', at + 4, at + 8);
    const data = bytes.subarray(at + 8, at + 8 + length);
    if (type === 'IHDR') {
      width = data.readUInt32BE(0);
      height = data.readUInt32BE(4);
      depth = data[8]!;
      colour = data[9]!;
      interlace = data[12]!;
    } else if (type === 'IDAT') idat.push(data);
    else if (type === 'IEND') break;
    at += 12 + length; // length, type, data, CRC
  }
  if (depth !== 8 || (colour !== 2 && colour !== 6) || interlace !== 0)
    throw new Error(`a PNG this reader does not read: depth ${depth}, colour type ${colour}`);
  const bpp = colour === 6 ? 4 : 3;
  const stride = width * bpp;
  const raw = inflateSync(Buffer.concat(idat));
  expect(raw.length).toBe(height * (stride + 1));
  const out = Buffer.alloc(height * stride);
  for (let y = 0; y < height; y++) {
    const filter = raw[y * (stride + 1)]!;
    for (let i = 0; i < stride; i++) {
      const x = raw[y * (stride + 1) + 1 + i]!;
      const a = i >= bpp ? out[y * stride + i - bpp]! : 0;
      const b = y > 0 ? out[(y - 1) * stride + i]! : 0;
      const c = i >= bpp && y > 0 ? out[(y - 1) * stride + i - bpp]! : 0;
      let p: number;
      if (filter === 0) p = 0;
      else if (filter === 1) p = a;
      else if (filter === 2) p = b;
      else if (filter === 3) p = Math.floor((a + b) / 2);
      else if (filter === 4) {
        const e = a + b - c;
        const pa = Math.abs(e - a),
          pb = Math.abs(e - b),
          pc = Math.abs(e - c);
        p = pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
      } else throw new Error(`unknown scanline filter ${filter}`);
      out[y * stride + i] = (x + p) & 0xff;
    }
  }
  return {
    width,
    height,
    at: (x, y) => {
      const o = y * stride + x * bpp;
      return [out[o]!, out[o + 1]!, out[o + 2]!, bpp === 4 ? out[o + 3]! : 255];
    },
  };
}

let page: Page;
let browser: E2eBrowser | undefined;
let pageErrors: string[] = [];

describe('the drawing in Chromium: zoom, and a PNG of the whole sheet', () => {
  beforeAll(async () => {
    browser = await startBrowser('drawing-png');
    ({ page, pageErrors } = browser);
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('zooms the demo design drawing from the keyboard and moves it with an arrow', async () => {
    await openDemoDesignStep(page, e2eBaseUrl(), 'sizing');
    const box = page.locator('[data-test="design-drawing"]');
    const svg = box.locator('svg');
    await svg.waitFor();
    const whole = await svg.getAttribute('viewBox');
    const [, , w, h] = whole!.split(' ').map(Number);
    expect(whole).toBe(
      `0 0 ${await svg.getAttribute('width')} ${await svg.getAttribute('height')}`,
    );
    await box.focus();
    await page.keyboard.press('+');
    await page.keyboard.press('+');
    await expect
      .poll(() => page.locator('[data-test="drawing-zoom-level"]').textContent())
      .toBe('200 %');
    const zoomed = (await svg.getAttribute('viewBox'))!.split(' ').map(Number);
    // half the sheet each way; the attribute is rounded to 0.01 of a sheet pixel
    expectRel(zoomed[2]!, w! / 2, 1e-4);
    expectRel(zoomed[3]!, h! / 2, 1e-4);
    await page.keyboard.press('ArrowRight');
    await expect
      .poll(async () => Number((await svg.getAttribute('viewBox'))!.split(' ')[0]))
      .toBeGreaterThan(zoomed[0]!);
    await browser!.shot('drawing-zoomed');
  });

  it('the PNG, downloaded while zoomed, is the whole SVG sheet at twice its size, and drawn on', async () => {
    const [svgFile] = await Promise.all([
      page.waitForEvent('download'),
      page.locator('[data-test="drawing-svg"]').click(),
    ]);
    const sheet = await readFile((await svgFile.path())!, 'utf8');
    const size =
      /<svg\b[^>]*\bwidth="([\d.]+)" height="([\d.]+)" viewBox="0 0 ([\d.]+) ([\d.]+)"/.exec(sheet);
    expect(size).not.toBeNull();
    const [sw, sh] = [Number(size![1]), Number(size![2])];
    expect([Number(size![3]), Number(size![4])]).toEqual([sw, sh]); // the whole sheet
    expect(sw).toBe(1100); // the files' sheet width

    const [pngFile] = await Promise.all([
      page.waitForEvent('download'),
      page.locator('[data-test="drawing-png"]').click(),
    ]);
    expect(pngFile.suggestedFilename()).toMatch(/-drawing\.png$/);
    const png = readPng(await readFile((await pngFile.path())!));
    // painted at 2 × the SVG's size (svgToPng's pixel ratio)
    expect(png.width).toBe(Math.round(sw * 2));
    expect(png.height).toBe(Math.round(sh * 2));

    // not blank: a grid of samples over the whole picture finds the white paper, the dark
    // lines and text, and colours between; ink in the top and the bottom third (plan above
    // section: the whole sheet, not a zoomed part of it)
    const colours = new Set<string>();
    let inkTop = 0,
      inkBottom = 0,
      samples = 0;
    for (let y = 0; y < png.height; y += 3)
      for (let x = 0; x < png.width; x += 3) {
        const [r, g, b, a] = png.at(x, y);
        expect(a).toBe(255); // painted on white, nothing see-through
        colours.add(`${r},${g},${b}`);
        samples++;
        if (r + g + b < 3 * 160) {
          if (y < png.height / 3) inkTop++;
          else if (y > (2 * png.height) / 3) inkBottom++;
        }
      }
    expect(colours.has('255,255,255')).toBe(true);
    expect(colours.size).toBeGreaterThan(10);
    expect(inkTop).toBeGreaterThan(100);
    expect(inkBottom).toBeGreaterThan(100);
    // mostly paper: a drawing, not a filled rectangle
    expect(inkTop + inkBottom).toBeLessThan(samples / 2);
  });

  it('0 fits the whole drawing again', async () => {
    const box = page.locator('[data-test="design-drawing"]');
    const svg = box.locator('svg');
    await box.focus();
    await page.keyboard.press('0');
    await expect
      .poll(() => page.locator('[data-test="drawing-zoom-level"]').textContent())
      .toBe('100 %');
    expect(await svg.getAttribute('viewBox')).toBe(
      `0 0 ${await svg.getAttribute('width')} ${await svg.getAttribute('height')}`,
    );
    expect(pageErrors).toEqual([]);
  });
});
