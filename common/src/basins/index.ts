// Dissipators: catalogue, screening, sizing, exit protection, flotation, drawing. SI inside.
export * from './types';
export * from './defaults';
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
export * from './riprap';
export * from './flotation';
export * from './design';
export {
  designDissipators,
  screeningContext,
  type DissipatorStudyOptions,
  type DissipatorStudyResult,
  type DesignEntry,
} from './study';
