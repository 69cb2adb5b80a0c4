// The take-off's overrides, checked in the project's units (bounds: TAKEOFF_LIMITS, SI,
// converted for a US form) before takeoffOverridesToSI turns them into what takeoff() reads.
import { number, object, string, type ObjectSchema } from 'yup';
import {
  SOIL_KINDS,
  TAKEOFF_ASSUMPTIONS,
  TAKEOFF_ASSUMPTION_KEYS,
  type TakeoffAssumptionKey,
  type TakeoffOverrides,
} from '../takeoff/assumptions';
import { assumptionFromSI, TAKEOFF_ASSUMPTION_LABELS } from '../takeoff/format';
import type { UnitSystem } from '../range/types';
import { TAKEOFF_LIMITS } from './limits';

const BOUNDS: Record<TakeoffAssumptionKey, { min: number; max: number }> = {
  slabThickness: TAKEOFF_LIMITS.thickness,
  wallThickness: TAKEOFF_LIMITS.thickness,
  concreteWaste: TAKEOFF_LIMITS.fraction,
  rebarSlab: TAKEOFF_LIMITS.reinforcement,
  rebarWalls: TAKEOFF_LIMITS.reinforcement,
  rebarAppurtenances: TAKEOFF_LIMITS.reinforcement,
  rebarCutoffs: TAKEOFF_LIMITS.reinforcement,
  workingRoom: TAKEOFF_LIMITS.workingRoom,
  sideSlope: TAKEOFF_LIMITS.sideSlope,
  beddingThickness: TAKEOFF_LIMITS.beddingThickness,
  riprapDensity: TAKEOFF_LIMITS.riprapDensity,
  geotextileLap: TAKEOFF_LIMITS.fraction,
  jointSpacing: TAKEOFF_LIMITS.jointSpacing,
};

/** The bounds of one override in a unit system (SI bounds converted, rounded inwards). */
export function takeoffOverrideBounds(
  key: TakeoffAssumptionKey,
  units: UnitSystem,
): { min: number; max: number; unit: string } {
  const b = BOUNDS[key];
  const u = TAKEOFF_ASSUMPTIONS[key].unitKind;
  const min = assumptionFromSI(b.min, u, units);
  const max = assumptionFromSI(b.max, u, units);
  const r = (x: number, up: boolean): number => {
    const s = Number(x.toPrecision(3));
    // keep the converted bound inside the SI one
    return up
      ? s < x
        ? Number((x * (1 + 1e-3)).toPrecision(3))
        : s
      : s > x
        ? Number((x * (1 - 1e-3)).toPrecision(3))
        : s;
  };
  return { min: r(min, true), max: r(max, false), unit: TAKEOFF_ASSUMPTION_LABELS[u][units] };
}

/** Overrides of the take-off's assumptions in `units` (all optional; unknown keys refused). */
export function takeoffOverridesSchema(units: UnitSystem): ObjectSchema<TakeoffOverrides> {
  const shape: Record<string, unknown> = {
    soil: string()
      .oneOf([...SOIL_KINDS], `The soil must be one of: ${SOIL_KINDS.join(', ')}.`)
      .optional(),
  };
  for (const key of TAKEOFF_ASSUMPTION_KEYS) {
    const { min, max, unit } = takeoffOverrideBounds(key, units);
    const label = TAKEOFF_ASSUMPTIONS[key].label;
    const u = unit === '-' ? '' : ` ${unit}`;
    shape[key] = number()
      .typeError(`${label} must be a number.`)
      .min(min, `${label} must be at least ${min}${u}.`)
      .max(max, `${label} must be at most ${max}${u}.`)
      .optional();
  }
  return object(shape as never)
    .noUnknown(true, (p) => `Unknown take-off assumption: ${String(p.unknown)}.`)
    .strict() as unknown as ObjectSchema<TakeoffOverrides>;
}
