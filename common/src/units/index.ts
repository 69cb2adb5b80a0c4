// Units at the edges of the engine: user input and results between SI and US customary, by kind
// of quantity, with the factors of ./factors (mathjs's own numbers, NIST SP 811). Conversion
// between arbitrary unit strings (mathjs) is ./convert, kept apart so that these never load it.
import type { StudyInput, UnitSystem } from '../range/types';
import type { StudyResult } from '../result';
import { BASIN_DEFAULT_PROVENANCE } from '../basins/defaults';
import { fieldKind } from './fields';
import { US_TO_SI } from './factors';

export { FOOT, G, MANNING_K_SI, MANNING_K_US, RHO_WATER } from './constants';
export {
  type DeepKindsOf,
  type DeepNumericKeys,
  FIELD_KINDS,
  fieldKind,
  JUMP_LOCATION_KINDS,
  JUMP_SITUATION_KINDS,
  type KindsOf,
  type NumericKeys,
  STUDY_INPUT_KINDS,
} from './fields';
export {
  DISPLAY_DECIMALS,
  DIMENSIONLESS_DECIMALS,
  displayDecimals,
  displayText,
  groupedNumber,
  significant,
} from './rounding';

/** Kinds of quantity the app shows; each has an SI and a US customary unit. */
export type QuantityKind =
  | 'length'
  | 'area'
  | 'volume'
  | 'earthwork'
  | 'discharge'
  | 'unitDischarge'
  | 'velocity'
  | 'force'
  | 'pressure'
  | 'power'
  | 'mass'
  | 'weirCoefficient'
  /** force per metre of basin length (slab flotation), kN/m ⇄ lbf/ft */
  | 'lineLoad'
  /** unit weight, kN/m³ ⇄ lbf/ft³ (pcf) */
  | 'unitWeight';

/** mathjs unit strings per kind and system. */
export const UNITS: Record<QuantityKind, Record<UnitSystem, string>> = {
  length: { SI: 'm', US: 'ft' },
  area: { SI: 'm^2', US: 'ft^2' },
  volume: { SI: 'm^3', US: 'ft^3' },
  earthwork: { SI: 'm^3', US: 'yd^3' },
  discharge: { SI: 'm^3/s', US: 'cfs' },
  unitDischarge: { SI: 'm^2/s', US: 'ft^2/s' },
  velocity: { SI: 'm/s', US: 'ft/s' },
  force: { SI: 'N', US: 'lbf' },
  pressure: { SI: 'Pa', US: 'psi' },
  power: { SI: 'W', US: 'hp' },
  mass: { SI: 'kg', US: 'lb' },
  // Q = C·L·H^1.5 → C has units length^0.5/time.
  weirCoefficient: { SI: 'm^0.5/s', US: 'ft^0.5/s' },
  lineLoad: { SI: 'kN/m', US: 'lbf/ft' },
  unitWeight: { SI: 'kN/m^3', US: 'lbf/ft^3' },
};

/** Labels for column headers. */
export const UNIT_LABELS: Record<QuantityKind, Record<UnitSystem, string>> = {
  length: { SI: 'm', US: 'ft' },
  area: { SI: 'm²', US: 'ft²' },
  volume: { SI: 'm³', US: 'ft³' },
  earthwork: { SI: 'm³', US: 'yd³' },
  discharge: { SI: 'm³/s', US: 'cfs' },
  unitDischarge: { SI: 'm²/s', US: 'ft²/s' },
  velocity: { SI: 'm/s', US: 'ft/s' },
  force: { SI: 'N', US: 'lb' },
  pressure: { SI: 'Pa', US: 'psi' },
  power: { SI: 'W', US: 'hp' },
  mass: { SI: 'kg', US: 'lb' },
  weirCoefficient: { SI: 'm^½/s', US: 'ft^½/s' },
  lineLoad: { SI: 'kN/m', US: 'lb/ft' },
  unitWeight: { SI: 'kN/m³', US: 'lb/ft³' },
};

/** SI value = US value × factor (1 US unit of the kind in SI). */
const factor = (kind: QuantityKind): number => US_TO_SI[kind];

/** A quantity from `system` into SI. @example toSIValue(1, 'length', 'US') // 0.3048 */
export function toSIValue(value: number, kind: QuantityKind, system: UnitSystem): number {
  return system === 'SI' ? value : value * factor(kind);
}

/** A quantity from SI into `system`. @example fromSIValue(0.3048, 'length', 'US') // 1 */
export function fromSIValue(value: number, kind: QuantityKind, system: UnitSystem): number {
  return system === 'SI' ? value : value / factor(kind);
}

/**
 * A small tree (the jump-position tool's situation or answer) between `system` and SI, every
 * number converted by the kind its key has in `kinds` (a typed map of units/fields.ts); a key
 * the map calls dimensionless, or does not list, is left as it is.
 * @example convertByKinds({ Q: 100 }, JUMP_SITUATION_KINDS, 'US', 'toSI') // { Q: 2.8316846592 }
 */
export function convertByKinds<T>(
  tree: T,
  kinds: Readonly<Record<string, QuantityKind | null>>,
  system: UnitSystem,
  dir: 'toSI' | 'fromSI',
): T {
  if (system === 'SI') return tree;
  const f = dir === 'toSI' ? toSIValue : fromSIValue;
  const node = (v: unknown, key: string | undefined): unknown => {
    if (typeof v === 'number') {
      const kind = key !== undefined && Object.hasOwn(kinds, key) ? kinds[key] : null;
      return kind && Number.isFinite(v) ? f(v, kind, system) : v;
    }
    if (Array.isArray(v)) return v.map((item) => node(item, key));
    if (v !== null && typeof v === 'object')
      return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, node(x, k)]));
    return v;
  };
  return node(tree, undefined) as T;
}

// The unit of a dissipator default (its provenance, SI) → the quantity it holds.
const DEFAULT_UNIT_KIND: Record<string, QuantityKind> = {
  m: 'length',
  'm/s': 'velocity',
  'm²/s': 'unitDischarge',
  'm³/s': 'discharge',
  'kN/m³': 'unitWeight',
};
function defaultKind(key: string): QuantityKind | null {
  const p = (BASIN_DEFAULT_PROVENANCE as Record<string, { unit: string } | undefined>)[key];
  return p ? (DEFAULT_UNIT_KIND[p.unit] ?? null) : null;
}

function kindOf(key: string, path: readonly string[]): QuantityKind | null {
  const parent = path[path.length - 1];
  const grand = path[path.length - 2];
  // Overrides of the dissipator defaults carry the units of their provenance.
  if (parent === 'defaults') return defaultKind(key);
  if (parent === 'concrete') return 'earthwork'; // concrete by element: m³ ⇄ yd³
  if (parent === 'slab' && (key === 'resisting' || key === 'uplift')) return 'lineLoad';
  if (parent === 'discharges' && (key === 'min' || key === 'max' || key === 'values'))
    return 'discharge';
  if (parent === 'lossModel') return null; // fraction, Cv, K: dimensionless
  if (parent === 'headwater' && key === 'C') return 'weirCoefficient';
  if (parent === 'momentum' && key === 'minimum') return 'volume';
  if (parent === 'specificEnergy' && key === 'minimum') return 'length';
  if (key === 'value' && grand === 'momentum') return 'volume'; // points[i].value
  if (key === 'value' && grand === 'specificEnergy') return 'length';
  if (key === 'value') return null;
  return fieldKind(key);
}

/** The SI unit label of an assumption (Provenance.unit) → its quantity. */
function assumptionKind(unit: string): QuantityKind | null {
  return DEFAULT_UNIT_KIND[unit] ?? null;
}

// Subtrees left in SI: the drawing is geometry in metres whose labels carry their quantity for
// the caller's formatter (drawingToSvg), so it is converted when drawn, not here; the study's
// warnings are coded data whose SI values studyWarningText converts when it phrases them.
const SI_SUBTREES = new Set(['drawing', 'warnings']);

function walk(
  node: unknown,
  path: string[],
  f: (v: number, k: QuantityKind) => number,
  to: UnitSystem | null,
): unknown {
  if (Array.isArray(node)) {
    const key = path[path.length - 1] ?? '';
    const parentPath = path.slice(0, -1);
    return node.map((item) => {
      if (typeof item === 'number') {
        const kind = kindOf(key, parentPath);
        return kind ? f(item, kind) : item;
      }
      // Array items inherit the array's key as context (e.g. points[] under momentum).
      return walk(item, path, f, to);
    });
  }
  if (node !== null && typeof node === 'object') {
    const rec = node as Record<string, unknown>;
    // An assumption { key, value, defaultValue, unit }: converted by its own unit, relabelled.
    if (
      to &&
      typeof rec.unit === 'string' &&
      typeof rec.value === 'number' &&
      typeof rec.defaultValue === 'number'
    ) {
      const kind = assumptionKind(rec.unit) ?? UNIT_LABELS_SI_TO_KIND.get(rec.unit) ?? null;
      if (!kind) return { ...rec };
      return {
        ...rec,
        value: f(rec.value, kind),
        defaultValue: f(rec.defaultValue, kind),
        unit: UNIT_LABELS[kind][to],
      };
    }
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(rec)) {
      if (typeof v === 'number') {
        const kind = kindOf(k, path);
        out[k] = kind ? f(v, kind) : v;
      } else if (typeof v === 'function' || SI_SUBTREES.has(k)) {
        out[k] = v;
      } else out[k] = walk(v, [...path, k], f, to);
    }
    return out;
  }
  return node;
}

// Either system's label → kind, so an assumption already shown in US units converts back.
const UNIT_LABELS_SI_TO_KIND = new Map<string, QuantityKind>(
  (Object.keys(UNIT_LABELS) as QuantityKind[]).flatMap((k) => [
    [UNIT_LABELS[k].SI, k] as const,
    [UNIT_LABELS[k].US, k] as const,
  ]),
);

/**
 * The whole StudyInput in SI (what the engine takes). US input: ft, cfs, ft/s, ft²/s, weir
 * C in ft^0.5/s; Manning's n, slopes, Cc, Cv, K unchanged (n is the same number in both
 * systems once k = 1.486 is used in US units).
 */
export function toSI(input: StudyInput): StudyInput {
  if (input.units !== 'US') return input;
  // Idempotent: the output says 'SI'; the user's units travel on as displayUnits (words, tables).
  const si = walk(input, [], (v, k) => toSIValue(v, k, 'US'), 'SI') as StudyInput;
  return { ...si, units: 'SI', displayUnits: input.displayUnits ?? 'US' };
}

/** An SI StudyInput shown in `system` units (the inverse of toSI); the output says `system`. */
export function inputFromSI(input: StudyInput, system: UnitSystem): StudyInput {
  const rest: StudyInput = { ...input };
  delete rest.displayUnits;
  if (system === 'SI') return input.units === 'SI' ? input : { ...rest, units: 'SI' };
  if (input.units === 'US') return input;
  const us = walk(rest, [], (v, k) => fromSIValue(v, k, 'US'), 'US') as StudyInput;
  return { ...us, units: 'US' };
}

/**
 * A StudyResult (SI) in the units the user works in: lengths ft, Q cfs, q ft²/s, V ft/s,
 * excavation and concrete yd³, power hp, momentum ft³, slab loads lbf/ft; the dissipator
 * designs (blocks, sill, walls, slab, riprap, aprons) and the assumptions in force (value and
 * unit label) too. The drawing stays SI (its labels carry their quantity for drawingToSvg's
 * formatter), and so do the study's coded warnings (studyWarningText phrases them in a unit
 * system). Text is not rewritten here: runStudy already words the sizing's warnings and the
 * reasons in the input's units.
 */
export function fromSI(result: StudyResult, system: UnitSystem): StudyResult {
  if (system === 'SI') return result;
  return walk(result, [], (v, k) => fromSIValue(v, k, 'US'), 'US') as StudyResult;
}

/** A StudyResult in US customary back to SI (the inverse of fromSI(…, 'US')). */
export function resultToSI(result: StudyResult, system: UnitSystem): StudyResult {
  if (system === 'SI') return result;
  return walk(result, [], (v, k) => toSIValue(v, k, 'US'), 'SI') as StudyResult;
}
export { phraseMessage, type PhraseUnits } from './phrase';
export { unitFormat, type UnitFormat } from './format';
