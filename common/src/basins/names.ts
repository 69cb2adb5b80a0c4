// The published name of every dissipator type, in the catalogue's order: read by the type
// modules themselves, by the input schema (the ids it accepts) and by the messages (a type's
// name in a sentence). A module of its own, with no code of the engine behind it, so a page that
// only names a type does not load the designs with the catalogue (catalogue.ts).
import type { DissipatorTypeId } from './types';

export const DISSIPATOR_NAMES: Readonly<Record<DissipatorTypeId, string>> = {
  'usbr-1': 'USBR Type I basin (free jump on a plain apron)',
  'usbr-2': 'USBR Type II basin',
  'usbr-3': 'USBR Type III basin',
  'usbr-4': 'USBR Type IV basin',
  saf: 'SAF basin',
  'usbr-6': 'USBR Type VI impact basin',
  'usbr-9': 'USBR Type IX baffled apron',
  'riprap-apron': 'Riprap apron (culvert outlet)',
  'flip-bucket': 'Flip bucket with plunge pool',
  'slotted-bucket': 'Slotted (submerged) bucket',
};

/** Every type id, in the catalogue's order. */
export const DISSIPATOR_IDS = Object.keys(DISSIPATOR_NAMES) as DissipatorTypeId[];
