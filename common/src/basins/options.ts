// What the user may set for the dissipator part of a study (all optional). Kept apart from the
// dissipator orchestration so the study input's type needs nothing that computes.
import type { DesignOptions } from './design';
import type { DrawingOptions } from '../drawing/geometry';
import type { DebrisLevel, DissipatorTypeId, ScreeningContext } from './types';

export interface DissipatorStudyOptions extends DesignOptions {
  debris?: DebrisLevel;
  /** the culvert at the outlet when the study input does not describe it */
  culvert?: ScreeningContext['culvert'];
  /** the type to design instead of the recommended one */
  chosenType?: DissipatorTypeId;
  /** further types to design as alternatives whatever their verdict */
  alternatives?: DissipatorTypeId[];
  drawing?: DrawingOptions;
}
