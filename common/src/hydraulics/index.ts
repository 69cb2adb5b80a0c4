// The hydraulics engine: SI inside (m, s, m³/s), pure, no I/O.
export * from './sections';
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
export * from './interpolate';
export * from './inflow';
export * from './tailwater';
export * from './profiles';
export * from './diagrams';
