// The search from a request in the input's units (the API's compute pool and the browser's
// worker): the input, widths and overrides to SI, then cheapestDesign. Rates are per SI unit.
import { InputError } from '../errors';
import type { CheapestRequest } from '../schemas/search';
import { takeoffOverridesToSI } from '../takeoff/format';
import { toSI, toSIValue } from '../units';
import { cheapestDesign, type CheapestSearchResult } from './cheapest';

const OWN_FIELDS = /^(width|rates|overrides|body)\b/;

/**
 * The cheapest design for a request already checked by cheapestRequestSchema. Refusals of the
 * study input name their field below `input.` (as the request body holds it). Result SI.
 */
export function cheapestFromRequest(req: CheapestRequest): CheapestSearchResult {
  const units = req.input.units === 'US' ? 'US' : 'SI';
  const study = toSI(req.input);
  const len = (v: number): number => toSIValue(v, 'length', units);
  try {
    return cheapestDesign({
      study,
      width: {
        min: len(req.width.min),
        max: len(req.width.max),
        ...(req.width.steps !== undefined ? { steps: req.width.steps } : {}),
      },
      rates: req.rates,
      ...(req.overrides ? { overrides: takeoffOverridesToSI(req.overrides, units) } : {}),
    });
  } catch (e) {
    if (e instanceof InputError && !OWN_FIELDS.test(e.field))
      throw new InputError(`input.${e.field}`, e.code, e.message, { ...e.values }, { cause: e });
    throw e;
  }
}
