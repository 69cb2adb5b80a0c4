// Drawing of a sized basin: geometry of plan and section (metres) and its SVG rendering, shared
// by the web app and the proposal PDF.
export {
  DRAWING_CAUTION,
  buildBasinDrawing,
  type ArrowItem,
  type DimensionItem,
  type Drawing,
  type DrawingItem,
  type DrawingOptions,
  type DrawingQuantity,
  type DrawingView,
  type FillStyle,
  type LabelItem,
  type LabelPart,
  type LineStyle,
  type PolylineItem,
  type Pt,
} from './geometry';
export {
  drawingToSvg,
  drawingView,
  formatSI,
  layoutDrawing,
  type DrawingLayout,
  type DrawingFormatter,
  type ScaleUnit,
  type SvgOptions,
} from './svg';
