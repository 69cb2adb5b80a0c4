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
  REASON_CODES,
  codedRefusalText,
  fieldWords,
  formatQuantity,
  reasonText,
  refusalDetailText,
  refusalText,
  screeningSummaryText,
  studyWarningText,
  typeName,
} from './messages';
// The study's warnings as data (code, severity, SI values with kinds, where); phrased in messages/
export {
  STUDY_WARNING_CODES,
  WARNING_SEVERITY,
  type StudyWarning,
  type StudyWarningCode,
  type Quantity,
  type Quoted,
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
