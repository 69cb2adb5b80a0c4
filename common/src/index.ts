// The face of @basinwright/common, grouped by topic. Each area appends its own export lines.

// Hydraulics engine (SI): sections, depths, jump, inflow, tailwater, profiles, diagrams
export * from './hydraulics';
export * from './schemas';
export * from './policy';

// Units (mathjs, private instance with cfs): SI ⇄ US customary at the edges
export * from './units';

// The discharge range (prepared once; floor solve, rows, the one jump-position rule)
export * from './range';
// The engine's input refusals (InputError: field + code) and their sentences (the one phraser)
export { InputError, isInputError, type InputErrorCode } from './errors';
export {
  INPUT_ERROR_CODES,
  codedRefusalText,
  fieldWords,
  formatQuantity,
  refusalText,
  studyWarningText,
} from './messages';
// The study's warnings as data (code, severity, SI values with kinds, where); phrased in messages/
export {
  STUDY_WARNING_CODES,
  WARNING_SEVERITY,
  type StudyWarning,
  type StudyWarningCode,
  type WarningCause,
  type WarningSeverity,
} from './warnings';
// The whole study: runStudy (a thin orchestration) and the result's shape
export * from './study';
// The version of runStudy's answer, stored beside a saved result
export { ENGINE_VERSION } from './version';

// Dissipators: catalogue, screening, sizing (sizeJumpBasin), exit protection, flotation
export * from './basins';

// Drawing of a sized basin: plan and section geometry, SVG (drawingToSvg)
export * from './drawing';

// Take-off of a sized design: quantities by element, their assumptions, the project's units
export {
  DEFAULT_SOIL,
  SOIL_KINDS,
  SOIL_SIDE_SLOPES,
  TAKEOFF_ASSUMPTIONS,
  TAKEOFF_ASSUMPTION_KEYS,
  TAKEOFF_ASSUMPTION_LABELS,
  TAKEOFF_ELEMENTS,
  TAKEOFF_ITEM_KINDS,
  TAKEOFF_QUANTITY_KINDS,
  assumptionFromSI,
  assumptionToSI,
  formatTakeoff,
  formatTakeoffTotals,
  pitVolume,
  takeoff,
  takeoffAssumptions,
  takeoffOverridesFromSI,
  takeoffOverridesToSI,
  takeoffQuantity,
  type DisplayTakeoffLine,
  type SoilKind,
  type Takeoff,
  type TakeoffAssumption,
  type TakeoffAssumptionKey,
  type TakeoffAssumptionSpec,
  type TakeoffAssumptionUnit,
  type TakeoffElement,
  type TakeoffItemKind,
  type TakeoffLine,
  type TakeoffOverrides,
  type TakeoffQuantityKind,
} from './takeoff';
// Concept estimate maths: priced lines, location factor, percentages, escalation, AACE range
export {
  AACE_BANDS,
  AACE_CLASSES,
  AACE_SOURCE,
  ESTIMATE_STEPS,
  PRICE_UNITS,
  estimate,
  isPriceUnit,
  quantityInUnit,
  type AaceClass,
  type EstimateInput,
  type EstimateLineInput,
  type EstimateLineResult,
  type EstimatePercentages,
  type EstimateResult,
  type PriceUnit,
} from './estimate';
// The sized types side by side and the cheapest design that works (width × type search)
export {
  cheapestDesign,
  cheapestFromRequest,
  checkRates,
  compareAlternatives,
  costOf,
  holdsEverywhere,
  measuresOf,
  rangeAtWidth,
  siRate,
  type CheapestSearchInput,
  type CheapestSearchResult,
  type SearchPoint,
  type TypeMeasures,
  type UnitRates,
} from './search';
