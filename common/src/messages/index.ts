// The one place where the engine's codes become sentences, in SI or US customary: refusals
// (refusals.ts), the engine's warnings and notes (warnings.ts) and the screening's reasons and
// summaries (reasons.ts), the jump-position notes (jump.ts); quote.ts says their quantities by the one rounding rule. The web, the
// API's 422s and the PDF phrase through here; nothing parses a sentence back.
export {
  INPUT_ERROR_CODES,
  codedRefusalText,
  fieldWords,
  engineFailureText,
  INTERNAL_FAILURE_TEXT,
  refusalText,
} from './refusals';
export { ROW_NOTE_TEXT, formatQuantity, rowNoteText, studyWarningText, typeName } from './warnings';
export { JUMP_NOTE_CODES, jumpNoteText } from './jump';
export { limitEntryText, REASON_CODES, reasonText, screeningSummaryText } from './reasons';
