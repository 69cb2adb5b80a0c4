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
// Issued versions, review and the audit trail: states, key figures, comparison
export * from './versions';
// The proposal PDF: rendering states and its sections
export * from './proposals';

// Dissipators: catalogue, screening, sizing (sizeJumpBasin), exit protection, flotation
export * from './basins';

// Drawing of a sized basin: plan and section geometry, SVG (drawingToSvg)
export * from './drawing';

// Plans: the one plan table (limits, features, the plan that lifts each) and billing states
export {
  BILLING_STATUSES,
  PLAN_FEATURES,
  PLAN_LIMIT_NAMES,
  PLAN_ORDER,
  PLAN_TABLE,
  WRITABLE_PROJECTS_RULE,
  allowedWhileReadOnly,
  featureLiftedBy,
  featureLimitText,
  limitFor,
  limitLiftedBy,
  limitReachedText,
  minimumSeats,
  planAllows,
  planName,
  type BillingStatus,
  type PlanDefinition,
  type PlanFeature,
  type PlanLimitName,
} from './plans';
// The firm's brand: contrast of the brand colour against white text (WCAG 2.x), logo limits
export * from './brand';
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
// Uncertainty: sensitivity of the floor (tornado data) and the seeded risk of sweep-out
export * from './uncertainty';
// Charts shared by the web and the proposal PDF: data in the user's units, and SVG
export * from './charts';
