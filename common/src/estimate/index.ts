// Concept estimate maths (pure): lines, location factor, percentages, escalation, accuracy.
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
