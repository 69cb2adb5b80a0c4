// How sure is the floor: uncertain inputs, their default spreads, sensitivity and seeded risk.
export {
  DISTRIBUTION_KINDS,
  SENSITIVITY_QUANTILES,
  quantile,
  validateDistribution,
  type Distribution,
} from './distributions';
export {
  AS_DESIGNED,
  BED_LOWERING_NOTE,
  UNCERTAIN_KEYS,
  UNCERTAIN_KIND,
  applicableKeys,
  defaultUncertainInputs,
  rangeWith,
  validateUncertainInputs,
  valuesAt,
  type NoJump,
  type UncertainInput,
  type UncertainKey,
  type Values,
} from './inputs';
export {
  runUncertainty,
  validateUncertaintyRequest,
  type HistogramBin,
  type SensitivityRow,
  type UncertaintyOptions,
  type UncertaintyRequest,
  type UncertaintyResult,
} from './run';
export { uncertaintyFromSI, uncertaintyToSI } from './edge';
export {
  TORNADO_LEGEND,
  UNCERTAIN_INPUT_NAMES,
  tornadoSvg,
  type TornadoSvgOptions,
} from './tornado';
