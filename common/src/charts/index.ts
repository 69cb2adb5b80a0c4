// Charts as data in the user's units (shared by the web and the proposal PDF) and as SVG.
export {
  CHART_COLOURS,
  energyChartSpec,
  markLabelPlace,
  rangeChartSpec,
  type ChartMark,
  type ChartSeries,
  type ChartSpec,
  type MarkLabelPlace,
  type RangeChartRow,
} from './spec';
export { chartToSvg, niceTicks, type ChartSvgOptions } from './svg';
