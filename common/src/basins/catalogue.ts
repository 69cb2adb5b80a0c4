// The catalogue of dissipator types: adding a type means adding its module and one line here.
import { InputError } from '../errors';
import type { DissipatorModule, DissipatorTypeId, JumpBasinType } from './types';
import { usbr1 } from './types/usbr1';
import { usbr2 } from './types/usbr2';
import { usbr3 } from './types/usbr3';
import { usbr4 } from './types/usbr4';
import { saf } from './types/saf';
import { usbr6 } from './types/usbr6';
import { usbr9 } from './types/usbr9';
import { riprapApron } from './types/riprapApron';
import { flipBucket, slottedBucket } from './types/jets';

export const DISSIPATOR_CATALOGUE: readonly DissipatorModule[] = [
  usbr1,
  usbr2,
  usbr3,
  usbr4,
  saf,
  usbr6,
  usbr9,
  riprapApron,
  flipBucket,
  slottedBucket,
];

export const JUMP_BASIN_TYPES: readonly JumpBasinType[] = [
  'usbr-1',
  'usbr-2',
  'usbr-3',
  'usbr-4',
  'saf',
];

/** The module of a type; RangeError naming the argument for an unknown type. */
export function getDissipator(id: DissipatorTypeId): DissipatorModule {
  const m = DISSIPATOR_CATALOGUE.find((x) => x.id === id);
  if (!m)
    throw new InputError(
      'type',
      'unknown-option',
      `type "${String(id)}" is not in the dissipator catalogue`,
      {},
    );
  return m;
}

export function isJumpBasinType(id: string): id is JumpBasinType {
  return (JUMP_BASIN_TYPES as readonly string[]).includes(id);
}
