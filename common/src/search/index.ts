// Alternatives side by side and the cheapest design that works (width × type search).
export {
  checkRates,
  compareAlternatives,
  costOf,
  measuresOf,
  siRate,
  type TypeMeasures,
  type UnitRates,
} from './cost';
export {
  cheapestDesign,
  holdsEverywhere,
  rangeAtWidth,
  type CheapestSearchInput,
  type CheapestSearchResult,
  type SearchPoint,
} from './cheapest';
export { cheapestFromRequest } from './request';
