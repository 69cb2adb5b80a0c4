// Zoom and pan of a drawing through its SVG viewBox: the picture stays the size of its box and
// the viewBox shows a part of the whole sheet, so lines and labels grow together and stay sharp.
// Nothing here touches the files the drawing is downloaded as: they are drawn afresh, whole.
import { computed, ref, watch, type Ref } from 'vue';

/** The zoom limits: 100 % is the whole drawing, 800 % the closest view. */
export const MIN_ZOOM = 1;
export const MAX_ZOOM = 8;
/** The steps the buttons and the + / − keys go through. */
export const ZOOM_STEPS = [1, 1.5, 2, 3, 4, 6, 8] as const;
/** One arrow key moves the view by this share of what is shown. */
export const PAN_SHARE = 0.1;

export interface ViewBox {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** The whole sheet's size, from its root `<svg … viewBox="0 0 W H">`; null if it has none. */
export function sheetSize(svg: string): { w: number; h: number } | null {
  const m = /<svg\b[^>]*\bviewBox="0 0 ([\d.]+) ([\d.]+)"/.exec(svg);
  if (!m) return null;
  const w = Number(m[1]),
    h = Number(m[2]);
  return w > 0 && h > 0 ? { w, h } : null;
}

const EPS = 1e-9;
const clamp = (v: number, lo: number, hi: number): number => Math.min(hi, Math.max(lo, v));

/**
 * Zoom and pan state over a sheet of `size`. `zoom` is 1 for the whole sheet; `centre` is the
 * point of the sheet at the middle of the view. The view never leaves the sheet and the zoom
 * never leaves MIN_ZOOM…MAX_ZOOM; a request beyond a limit sets `atLimit` so the page says so.
 */
export function useDrawingZoom(size: Ref<{ w: number; h: number } | null>) {
  const zoom = ref(1);
  const cx = ref(0);
  const cy = ref(0);
  /** 'max' or 'min' when the last request asked past that limit; null otherwise. */
  const atLimit = ref<'max' | 'min' | null>(null);

  function showWhole(): void {
    zoom.value = 1;
    cx.value = (size.value?.w ?? 0) / 2;
    cy.value = (size.value?.h ?? 0) / 2;
    atLimit.value = null;
  }
  // a new sheet size (another drawing, another box width) starts whole again
  watch(size, (s, old) => {
    if (!old || !s || s.w !== old.w || s.h !== old.h) showWhole();
  });
  showWhole();

  /** Keeps the centre where the view stays inside the sheet. */
  function keepInside(): void {
    const s = size.value;
    if (!s) return;
    const hw = s.w / zoom.value / 2,
      hh = s.h / zoom.value / 2;
    cx.value = clamp(cx.value, hw, s.w - hw);
    cy.value = clamp(cy.value, hh, s.h - hh);
  }

  const viewBox = computed<ViewBox | null>(() => {
    const s = size.value;
    if (!s) return null;
    const w = s.w / zoom.value,
      h = s.h / zoom.value;
    return { x: cx.value - w / 2, y: cy.value - h / 2, w, h };
  });

  /**
   * Zoom to `z` keeping the sheet point under (fx, fy) — shares 0…1 of the view's width and
   * height — where it is; the centre of the view when not given.
   */
  function zoomTo(z: number, fx = 0.5, fy = 0.5): void {
    const vb = viewBox.value;
    if (!vb) return;
    if (z > MAX_ZOOM + EPS) atLimit.value = zoom.value >= MAX_ZOOM - EPS ? 'max' : null;
    else if (z < MIN_ZOOM - EPS) atLimit.value = zoom.value <= MIN_ZOOM + EPS ? 'min' : null;
    else atLimit.value = null;
    const next = clamp(z, MIN_ZOOM, MAX_ZOOM);
    // the sheet point under the pointer, before and after
    const px = vb.x + fx * vb.w,
      py = vb.y + fy * vb.h;
    const w = vb.w * (zoom.value / next),
      h = vb.h * (zoom.value / next);
    zoom.value = next;
    cx.value = px - fx * w + w / 2;
    cy.value = py - fy * h + h / 2;
    keepInside();
  }

  /** The next step in (+1) or out (−1) from the present zoom. */
  function step(dir: 1 | -1, fx?: number, fy?: number): void {
    const z = zoom.value;
    const next =
      dir > 0
        ? ZOOM_STEPS.find((s) => s > z + EPS)
        : [...ZOOM_STEPS].reverse().find((s) => s < z - EPS);
    zoomTo(next ?? (dir > 0 ? MAX_ZOOM * 2 : MIN_ZOOM / 2), fx, fy);
  }

  /** Move the view by (dx, dy) in sheet units; nothing moves at 100 %. */
  function panBy(dx: number, dy: number): void {
    cx.value += dx;
    cy.value += dy;
    keepInside();
  }

  /** Move the view by `share` of what is shown, sideways (ax) and up or down (ay). */
  function panShare(ax: number, ay: number, share = PAN_SHARE): void {
    const vb = viewBox.value;
    if (vb) panBy(ax * share * vb.w, ay * share * vb.h);
  }

  const canZoomIn = computed(() => zoom.value < MAX_ZOOM - EPS);
  const canZoomOut = computed(() => zoom.value > MIN_ZOOM + EPS);

  return {
    zoom,
    viewBox,
    canZoomIn,
    canZoomOut,
    atLimit,
    showWhole,
    zoomTo,
    step,
    panBy,
    panShare,
  };
}

/** A viewBox as the attribute's text, rounded to 0.01 of a sheet pixel. */
export function viewBoxText(vb: ViewBox): string {
  const r = (v: number): number => Math.round(v * 100) / 100;
  return `${r(vb.x)} ${r(vb.y)} ${r(vb.w)} ${r(vb.h)}`;
}
