// The hydraulics engine: SI inside (m, s, m³/s), pure, no I/O.
export {
  area,
  centroidDepth,
  centroidMoment,
  geometry,
  hydraulicRadius,
  maxDepth,
  type Section,
  sectionProperties,
  type SectionProperties,
  topWidth,
  validateSection,
  wettedPerimeter,
} from './sections';
export {
  criticalDepth,
  normalDepth,
  manningDischarge,
  froudeNumber,
  velocity,
  specificEnergy,
  momentumFunction,
  supercriticalDepth,
  subcriticalDepth,
  alternateDepths,
} from './depths';
export {
  type JumpClass,
  type JumpLengthMethod,
  type JumpResult,
  type JumpOptions,
  ConduitFullError,
  classifyJump,
  belangerRatio,
  USBR_LENGTH_CURVE,
  jumpLengthUSBR,
  jumpLengthHager,
  rollerLength,
  sequentDepth,
  conjugateDepth,
  hydraulicJump,
  rectangularJumpLoss,
  slopingApronJump,
  HORIZONTAL_APRON_SLOPE,
  type SlopingApronJump,
} from './jump';
export { G, RHO_WATER, MANNING_K_SI, MANNING_K_US } from '../units/constants';
export { createMonotoneInterpolant, type Interpolant, type Interpolated } from './interpolate';
export {
  gateFlow,
  gateOpening,
  gateUpstreamDepth,
  jetFlareTangent,
  outletFlow,
  toeFromHead,
  toeFromKnown,
  toeFromOutlet,
  validateLossModel,
  weirHead,
  type GateFlow,
  type KnownToe,
  type LossModel,
  type OutletFlow,
  type ToeConditions,
} from './inflow';
export type { HeadwaterSpec, InflowNote, StudyInflow, Toe } from './toeByInflow';
export {
  chuteDepthAt,
  chuteFoot,
  chuteProfile,
  validateChute,
  type ChuteGeometry,
  type ChuteProfile,
} from './chute';
export {
  makeTailwaterRating,
  type TailwaterAt,
  type TailwaterRating,
  type TailwaterSpec,
} from './tailwater';
export {
  directStepProfile,
  jumpToeDistance,
  locateJump,
  type JumpLocation,
  type JumpNote,
  type JumpNoteCode,
  type JumpSituation,
  type ProfilePoint,
} from './profiles';
export { type CurvePoint, jumpDiagrams, type JumpDiagrams } from './diagrams';
