// Take-off of a sized design (SI inside): quantities by element with their assumptions.
export {
  DEFAULT_SOIL,
  SOIL_KINDS,
  SOIL_SIDE_SLOPES,
  TAKEOFF_ASSUMPTIONS,
  TAKEOFF_ASSUMPTION_KEYS,
  type SoilKind,
  type TakeoffAssumption,
  type TakeoffAssumptionKey,
  type TakeoffAssumptionSpec,
  type TakeoffAssumptionUnit,
  type TakeoffOverrides,
} from './assumptions';
export {
  TAKEOFF_ELEMENTS,
  TAKEOFF_ITEM_KINDS,
  TAKEOFF_QUANTITY_KINDS,
  pitVolume,
  takeoff,
  takeoffAssumptions,
  type Takeoff,
  type TakeoffElement,
  type TakeoffItemKind,
  type TakeoffLine,
  type TakeoffQuantityKind,
} from './takeoff';
export {
  TAKEOFF_ASSUMPTION_LABELS,
  assumptionFromSI,
  assumptionToSI,
  formatTakeoff,
  formatTakeoffTotals,
  takeoffOverridesFromSI,
  takeoffOverridesToSI,
  takeoffQuantity,
  type DisplayTakeoffLine,
} from './format';
