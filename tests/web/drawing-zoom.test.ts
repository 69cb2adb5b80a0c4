// The drawing's zoom and pan (issue 13 item 1: every action by keyboard, the drawing's zoom
// included). They change only the on-screen SVG's viewBox; the downloads stay the whole sheet.
// The expected viewBoxes are worked out here from the sheet's size: a view of zoom z is the
// sheet's width and height divided by z, centred where it was, and never off the sheet. The
// drawing is the engine's own, of the seeded demo designs (the invented scenario of product.md).
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils';
import { runStudy, toSI } from '@basinwright/common';
import DesignDrawing from '../../web/src/components/DesignDrawing.vue';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';
import { expectRel } from '../support/tolerance';

const saved = vi.hoisted(() => ({
  files: [] as { name: string; data: Blob }[],
  png: [] as string[],
}));
vi.mock('../../web/src/download', () => ({
  downloadBlob: (name: string, data: Blob) => saved.files.push({ name, data }),
}));
vi.mock('../../web/src/composables/drawingFiles', async (original) => ({
  ...(await original<typeof import('../../web/src/composables/drawingFiles')>()),
  // jsdom has no canvas: the PNG is checked in Chromium (tests/e2e/drawing-png.test.ts); here
  // only which SVG it would be painted from
  svgToPng: async (svg: string) => {
    saved.png.push(svg);
    return new Blob(['png'], { type: 'image/png' });
  },
}));

const fenwick = runStudy(fenwickDesign).design!.drawing;
const caldwell = runStudy(toSI(caldwellDesign)).design!.drawing;

let wrapper: VueWrapper | undefined;
beforeEach(() => {
  saved.files.length = 0;
  saved.png.length = 0;
});
afterEach(() => {
  wrapper?.unmount();
  wrapper = undefined;
});

async function mountDrawing(drawing = fenwick) {
  const w = mount(DesignDrawing, { props: { drawing, units: 'SI' }, attachTo: document.body });
  wrapper = w;
  // The sheet is drawn in a task of its own after the box is mounted.
  await vi.waitFor(() => expect(w.find('[data-test="design-drawing"] svg').exists()).toBe(true));
  await flushPromises();
  return w;
}

const svgOf = (w: VueWrapper) => w.find('[data-test="design-drawing"] svg').element;
/** The sheet's own size, from the width and height the renderer wrote. */
const sheet = (w: VueWrapper) => {
  const el = svgOf(w);
  return { w: Number(el.getAttribute('width')), h: Number(el.getAttribute('height')) };
};
const vb = (w: VueWrapper) => svgOf(w).getAttribute('viewBox')!.split(' ').map(Number);
const level = (w: VueWrapper) => w.find('[data-test="drawing-zoom-level"]').text();
const said = (w: VueWrapper) => w.find('[data-test="drawing-zoom-limit"]').text();
const key = async (w: VueWrapper, k: string) =>
  w.find('[data-test="design-drawing"]').trigger('keydown', { key: k });
const click = async (w: VueWrapper, test: string) =>
  w.find(`[data-test="${test}"]`).trigger('click');
/** The viewBox of zoom z centred on (cx, cy), kept on the sheet — worked out independently. */
function expected(s: { w: number; h: number }, z: number, cx = s.w / 2, cy = s.h / 2) {
  const w = s.w / z,
    h = s.h / z;
  const x = Math.min(Math.max(cx - w / 2, 0), s.w - w);
  const y = Math.min(Math.max(cy - h / 2, 0), s.h - h);
  return [x, y, w, h];
}
function expectBox(got: number[], want: number[]) {
  // the attribute is rounded to 0.01 of a sheet pixel
  for (let i = 0; i < 4; i++)
    expect(Math.abs(got[i]! - want[i]!), `viewBox[${i}]`).toBeLessThan(0.006);
}

describe('the drawing zooms through its viewBox', () => {
  it('opens whole, at 100 %, its box a named Tab stop that says its keys', async () => {
    const w = await mountDrawing();
    const s = sheet(w);
    expect(s.w).toBe(1100); // jsdom lays out nothing: the box keeps its first width
    expectBox(vb(w), [0, 0, s.w, s.h]);
    expect(level(w)).toBe('100 %');
    const box = w.find('[data-test="design-drawing"]');
    expect(box.attributes('tabindex')).toBe('0');
    expect(box.attributes('role')).toBe('group');
    expect(box.attributes('aria-label')).toMatch(/plus and minus zoom/i);
    expect(box.attributes('aria-label')).toMatch(/arrow keys/i);
    for (const [test, name] of [
      ['drawing-zoom-in', 'Zoom in'],
      ['drawing-zoom-out', 'Zoom out'],
      ['drawing-fit', 'Fit'],
    ] as const)
      expect(w.find(`[data-test="${test}"]`).text()).toBe(name);
  });

  it('Zoom in and Zoom out step about the centre; Fit puts the whole drawing back', async () => {
    const w = await mountDrawing();
    const s = sheet(w);
    await click(w, 'drawing-zoom-in');
    expect(level(w)).toBe('150 %');
    expectBox(vb(w), expected(s, 1.5));
    await click(w, 'drawing-zoom-in');
    expect(level(w)).toBe('200 %');
    expectBox(vb(w), expected(s, 2));
    await click(w, 'drawing-zoom-out');
    expect(level(w)).toBe('150 %');
    expectBox(vb(w), expected(s, 1.5));
    await click(w, 'drawing-fit');
    expect(level(w)).toBe('100 %');
    expectBox(vb(w), [0, 0, s.w, s.h]);
  });

  it('answers + − 0 and the arrow keys; the arrows move only a zoomed view', async () => {
    const w = await mountDrawing();
    const s = sheet(w);
    // at 100 % an arrow is left to the page (it scrolls) and the view stays whole
    const ev = new KeyboardEvent('keydown', { key: 'ArrowRight', cancelable: true, bubbles: true });
    w.find('[data-test="design-drawing"]').element.dispatchEvent(ev);
    expect(ev.defaultPrevented).toBe(false);
    expectBox(vb(w), [0, 0, s.w, s.h]);

    await key(w, '+');
    await key(w, '=');
    expect(level(w)).toBe('200 %');
    // one arrow moves the view a tenth of what is shown
    await key(w, 'ArrowRight');
    expectBox(vb(w), expected(s, 2, s.w / 2 + 0.1 * (s.w / 2)));
    await key(w, 'ArrowDown');
    expectBox(vb(w), expected(s, 2, s.w / 2 + 0.1 * (s.w / 2), s.h / 2 + 0.1 * (s.h / 2)));
    await key(w, 'ArrowLeft');
    await key(w, 'ArrowUp');
    expectBox(vb(w), expected(s, 2));
    // far to the left the view stops at the sheet's edge
    for (let i = 0; i < 20; i++) await key(w, 'ArrowLeft');
    expect(vb(w)[0]).toBe(0);
    await key(w, '-');
    expect(level(w)).toBe('150 %');
    await key(w, '0');
    expect(level(w)).toBe('100 %');
    expectBox(vb(w), [0, 0, s.w, s.h]);
  });

  it('says its limits (100 %–800 %) rather than stopping silently', async () => {
    const w = await mountDrawing();
    const s = sheet(w);
    expect(w.text()).toContain('(100 %–800 %)');
    await key(w, '-');
    expect(level(w)).toBe('100 %');
    expect(said(w)).toBe('100 % shows the whole drawing.');
    for (let i = 0; i < 6; i++) await key(w, '+');
    expect(level(w)).toBe('800 %');
    expect(said(w)).toBe('');
    expect(w.find('[data-test="drawing-zoom-in"]').attributes('aria-disabled')).toBe('true');
    await click(w, 'drawing-zoom-in');
    expect(level(w)).toBe('800 %');
    expect(said(w)).toBe('800 % is the closest view.');
    expectBox(vb(w), expected(s, 8));
    await key(w, '-');
    expect(said(w)).toBe('');
  });

  it('Ctrl or ⌘ with the wheel zooms about the pointer; a bare wheel leaves it', async () => {
    const w = await mountDrawing();
    const s = sheet(w);
    const el = svgOf(w);
    // jsdom lays nothing out: the SVG stands at the sheet's size at the page's corner
    el.getBoundingClientRect = () => new DOMRect(0, 0, s.w, s.h);
    const box = w.find('[data-test="design-drawing"]');
    await box.trigger('wheel', { deltaY: -200, clientX: 0.25 * s.w, clientY: 0.75 * s.h });
    expectBox(vb(w), [0, 0, s.w, s.h]);
    await box.trigger('wheel', {
      deltaY: -200,
      ctrlKey: true,
      clientX: 0.25 * s.w,
      clientY: 0.75 * s.h,
    });
    const [x, y, vw, vh] = vb(w) as [number, number, number, number];
    expectRel(s.w / vw, Math.exp(0.4), 1e-3); // zoom × e^(200 × 0.002)
    expect(level(w)).toBe(`${Math.round(Math.exp(0.4) * 100)} %`);
    // the sheet point under the pointer stays under it
    expectRel(x + 0.25 * vw, 0.25 * s.w, 1e-4);
    expectRel(y + 0.75 * vh, 0.75 * s.h, 1e-4);
    await box.trigger('wheel', { deltaY: 100, metaKey: true, clientX: 0, clientY: 0 });
    expectRel(s.w / vb(w)[2]!, Math.exp(0.2), 1e-3);
  });

  it('drags a zoomed view: the drawing follows the pointer', async () => {
    const w = await mountDrawing();
    const s = sheet(w);
    svgOf(w).getBoundingClientRect = () => new DOMRect(0, 0, s.w, s.h);
    const box = w.find('[data-test="design-drawing"]');
    await key(w, '+');
    await key(w, '+'); // 200 %: one screen pixel is half a sheet pixel
    const before = vb(w);
    await box.trigger('pointerdown', { button: 0, pointerId: 1, clientX: 500, clientY: 300 });
    await box.trigger('pointermove', { pointerId: 1, clientX: 440, clientY: 280 });
    await box.trigger('pointerup', { pointerId: 1, clientX: 440, clientY: 280 });
    const after = vb(w);
    expectRel(after[0]! - before[0]!, 60 / 2, 1e-3);
    expectRel(after[1]! - before[1]!, 20 / 2, 1e-3);
    // after the button is let go the pointer moves nothing
    await box.trigger('pointermove', { pointerId: 1, clientX: 0, clientY: 0 });
    expect(vb(w)).toEqual(after);
  });

  it('starts whole again when the drawing changes size', async () => {
    const w = await mountDrawing(fenwick);
    await key(w, '+');
    expect(level(w)).toBe('150 %');
    const first = sheet(w);
    await w.setProps({ drawing: caldwell });
    await flushPromises();
    const next = sheet(w);
    expect(next.h).not.toBe(first.h); // another basin, another sheet
    expect(level(w)).toBe('100 %');
    expectBox(vb(w), [0, 0, next.w, next.h]);
  });

  it('downloads the whole drawing after a zoom, not the view', async () => {
    const w = await mountDrawing();
    const s = sheet(w);
    await key(w, '+');
    await key(w, '+');
    await key(w, 'ArrowRight');
    expect(vb(w)[2]).toBeLessThan(s.w);
    await click(w, 'drawing-svg');
    await vi.waitFor(() => expect(saved.files).toHaveLength(1));
    const text = await saved.files[0]!.data.text();
    const doc = new DOMParser().parseFromString(text, 'image/svg+xml');
    const root = doc.documentElement;
    const fw = root.getAttribute('width'),
      fh = root.getAttribute('height');
    expect(root.getAttribute('viewBox')).toBe(`0 0 ${fw} ${fh}`);
    expect(Number(fw)).toBe(1100); // the sheet width of every file
    // the same sheet as shown, every text on it
    expect(Number(fh)).toBe(s.h);
    expect(doc.querySelectorAll('text').length).toBe(svgOf(w).querySelectorAll('text').length);

    await click(w, 'drawing-png');
    await vi.waitFor(() => expect(saved.png).toHaveLength(1));
    const png = new DOMParser().parseFromString(saved.png[0]!, 'image/svg+xml').documentElement;
    expect(png.getAttribute('viewBox')).toBe(
      `0 0 ${png.getAttribute('width')} ${png.getAttribute('height')}`,
    );
    expect(saved.png[0]).toBe(text); // painted from the same whole sheet
  });
});
