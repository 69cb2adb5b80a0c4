// The drawing out to CAD: SVG (the renderer's own text), PNG (that SVG painted on a canvas)
// and DXF (dxf-writer), all from the same laid-out drawing (common's layoutDrawing), so the
// three files hold the same outlines, dimensions and text. Loaded only when a file is asked
// for: the workspace imports this module dynamically, keeping dxf-writer off every page.
import Drawing from 'dxf-writer';
import {
  layoutDrawing,
  type Drawing as BasinDrawing,
  type DrawingItem,
  type SvgOptions,
  type UnitSystem,
} from '@basinwright/common';

/** The DXF layers: what a CAD user switches on and off. */
export const DXF_LAYERS = {
  outline: 'OUTLINE',
  blocks: 'BLOCKS',
  water: 'WATER',
  dimensions: 'DIMENSIONS',
  text: 'TEXT',
} as const;

/** Outlines that are blocks, baffles, piers or sill teeth (the BLOCKS layer). */
const BLOCK_ROLES = new Set(['chute-block', 'baffle-pier', 'floor-block', 'sill-tooth', 'baffle']);

const FOOT = 0.3048; // international foot, exact by definition [NIST SP 811]

/** The layer a polyline of the drawing goes on. */
export function dxfLayerOf(it: Extract<DrawingItem, { kind: 'polyline' }>): string {
  if (it.style === 'water') return DXF_LAYERS.water;
  if (BLOCK_ROLES.has(it.role)) return DXF_LAYERS.blocks;
  return DXF_LAYERS.outline;
}

/**
 * The drawing as DXF text, in metres (SI projects) or feet (US), $INSUNITS set to match.
 * Each view keeps its true scale and is moved as a whole to where the sheet shows it (plan
 * above section), so distances measured in CAD are the structure's. Dimension lines and their
 * values go on DIMENSIONS, labels, leaders and arrows on TEXT.
 */
export function drawingToDxf(
  drawing: BasinDrawing,
  units: UnitSystem,
  opts: SvgOptions = {},
): string {
  const lay = layoutDrawing(drawing, opts);
  const u = units === 'US' ? 1 / FOOT : 1; // drawing units per metre
  const dxf = new Drawing();
  dxf.setUnits(units === 'US' ? 'Feet' : 'Meters');
  dxf.addLayer(DXF_LAYERS.outline, Drawing.ACI.CYAN, 'CONTINUOUS');
  dxf.addLayer(DXF_LAYERS.blocks, Drawing.ACI.GREEN, 'CONTINUOUS');
  dxf.addLayer(DXF_LAYERS.water, Drawing.ACI.BLUE, 'CONTINUOUS');
  dxf.addLayer(DXF_LAYERS.dimensions, Drawing.ACI.WHITE, 'CONTINUOUS');
  dxf.addLayer(DXF_LAYERS.text, Drawing.ACI.WHITE, 'CONTINUOUS');
  // sheet px (y down) → drawing units (y up), at the sheet's scale
  const k = u / lay.scale;
  for (const v of lay.views) {
    const l = v.layout;
    const P = (x: number, y: number): [number, number] => [(x + v.dx) * k, -(y + v.dy) * k];
    const X = (x: number): number => (x - lay.minX) * lay.scale;
    const Y = (y: number): number => (l.view.bounds.maxY - y) * lay.scale;
    for (const it of l.view.items) {
      if (it.kind === 'polyline') {
        dxf.setActiveLayer(dxfLayerOf(it));
        dxf.drawPolyline(
          it.points.map((p) => P(X(p.x), Y(p.y))),
          it.closed,
        );
      } else if (it.kind === 'arrow') {
        dxf.setActiveLayer(DXF_LAYERS.text);
        const a = { x: X(it.from.x), y: Y(it.from.y) },
          b = { x: X(it.to.x), y: Y(it.to.y) };
        dxf.drawLine(...P(a.x, a.y), ...P(b.x, b.y));
        const at = it.role === 'north' ? b : { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
        dxf.drawText(...P(at.x, Math.min(a.y, b.y, at.y) - 6), 11 * k, 0, it.text, 'center');
      }
    }
    dxf.setActiveLayer(DXF_LAYERS.dimensions);
    for (const d of l.dimensions) {
      dxf.drawLine(...P(d.a.x, d.a.y), ...P(d.a2.x, d.a2.y));
      dxf.drawLine(...P(d.b.x, d.b.y), ...P(d.b2.x, d.b2.y));
      dxf.drawLine(...P(d.a2.x, d.a2.y), ...P(d.b2.x, d.b2.y));
      if (d.tail) dxf.drawLine(...P(d.tail.from.x, d.tail.from.y), ...P(d.tail.to.x, d.tail.to.y));
      // SVG turns clockwise with y down; DXF counter-clockwise with y up
      dxf.drawText(...P(d.textAt.x, d.textAt.y), 11 * k, -d.angle, d.text, 'center');
    }
    dxf.setActiveLayer(DXF_LAYERS.text);
    for (const p of l.labels) {
      if (p.leader)
        dxf.drawLine(...P(p.leader.from.x, p.leader.from.y), ...P(p.leader.to.x, p.leader.to.y));
      const align = p.anchor === 'start' ? 'left' : p.anchor === 'middle' ? 'center' : 'right';
      dxf.drawText(...P(p.x, p.y), p.size * k, 0, p.text, align);
    }
  }
  return dxf.toDxfString();
}

/** The SVG painted on a canvas at `pixelRatio` × its size, as a PNG. */
export async function svgToPng(svg: string, pixelRatio = 2): Promise<Blob> {
  const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml;charset=utf-8' }));
  try {
    const img = new Image();
    await new Promise<void>((resolve, reject) => {
      img.onload = () => resolve();
      img.onerror = () => reject(new Error('the drawing could not be painted'));
      img.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(img.naturalWidth * pixelRatio);
    canvas.height = Math.round(img.naturalHeight * pixelRatio);
    const ctx = canvas.getContext('2d');
    if (!ctx) throw new Error('this browser cannot paint a canvas');
    ctx.fillStyle = '#ffffff';
    ctx.fillRect(0, 0, canvas.width, canvas.height);
    ctx.drawImage(img, 0, 0, canvas.width, canvas.height);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('no PNG was made'))), 'image/png'),
    );
  } finally {
    URL.revokeObjectURL(url);
  }
}
