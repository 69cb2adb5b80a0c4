// Dissipators: catalogue, screening, sizing, exit protection, flotation, drawing. SI inside.
export {
  type BaffleSet,
  type BlockSet,
  type CriterionId,
  type CriterionResult,
  type CriterionStatus,
  type DebrisLevel,
  type DischargeRow,
  type DissipatorFamily,
  type DissipatorModule,
  type DissipatorTypeId,
  type EndSill,
  type InflowKind,
  type JumpBasinSizing,
  type JumpBasinType,
  type JumpRules,
  type LimitEntry,
  type ReasonCode,
  type ScreeningContext,
} from './types';
export {
  type Assumption,
  BASIN_DEFAULT_PROVENANCE,
  BASIN_DEFAULTS,
  type BasinDefaultKey,
  type BasinDefaults,
  type Confidence,
  limitQuantity,
  listAssumptions,
  type Provenance,
  PUBLISHED_FIGURES,
  type PublishedFigure,
  type PublishedKey,
  publishedSI,
  resolveDefaults,
} from './defaults';
export { fitBlockRow, staggerBehind, staggeredRow, type BlockRow } from './blocks';
export { freeboard } from './freeboard';
export {
  DISSIPATOR_CATALOGUE,
  JUMP_BASIN_TYPES,
  getDissipator,
  isJumpBasinType,
} from './catalogue';
export { sizeJumpBasin, jumpRules, type SizeJumpBasinOptions } from './jumpBasin';
export { type3BaffleHeight, type3SillHeight } from './types/usbr3';
export { safTailwaterFactor, safLength } from './types/saf';
export { sizeImpactBasin, type ImpactBasinSizing } from './types/usbr6';
export { sizeBaffledApron, type BaffledApronSizing } from './types/usbr9';
export {
  screenDissipators,
  aggregateCriteria,
  type TypeScreening,
  type ScreeningInput,
  type Verdict,
} from './screening';
export {
  APRON_CLASSES,
  type CulvertApron,
  type CulvertApronStone,
  culvertApronStoneSize,
  designCulvertApron,
  isbashStoneSize,
  riprapBelowSill,
  type RiprapProtection,
  velocityStoneSize,
} from './riprap';
export { type FlotationCase, type FlotationResult, slabFlotation } from './flotation';
export {
  type BaffledApronDesign,
  type ConcreteQuantities,
  designBaffledApron,
  designImpactBasin,
  designJumpBasin,
  type DesignOptions,
  designRiprapApron,
  type DesignRow,
  type DissipatorDesign,
  type ImpactBasinDesign,
  type JumpBasinDesign,
  type JumpBasinDesignRow,
  type JumpDesignInput,
  type RiprapApronDesign,
} from './design';
export {
  designDissipators,
  screeningContext,
  type DissipatorStudyOptions,
  type DissipatorStudyResult,
  type DesignEntry,
} from './study';
