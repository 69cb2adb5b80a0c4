// The one place where the engine's codes become sentences, in SI or US customary: refusals
// (refusals.ts) and the study's warnings (warnings.ts). The web, the API's 422s and the PDF
// phrase through here; nothing parses a sentence back.
export { INPUT_ERROR_CODES, codedRefusalText, fieldWords, refusalText } from './refusals';
export { formatQuantity, studyWarningText } from './warnings';
