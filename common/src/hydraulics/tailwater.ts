// Tailwater rating TW(Q): a typed table of water-surface elevations, or normal depth by
// Manning in the downstream channel. Elevations on the project datum, m; SI inside.
import { InputError } from '../errors';
import { requireFinite, requirePositive } from './guards';
import { _normalDepth } from './depths';
import { validateSection, type Section } from './sections';
import { createMonotoneInterpolant } from './interpolate';

export type TailwaterSpec =
  | { kind: 'table'; rows: Array<{ Q: number; elevation: number }> }
  | { kind: 'manning'; section: Section; slope: number; manningN: number };

export interface TailwaterAt {
  /** water-surface elevation on the datum, m */
  elevation: number;
  /** depth above the downstream channel bed, m */
  depth: number;
  /** set when Q lies outside a rating table (value continued linearly from its end) */
  outside: 'below' | 'above' | null;
}

export type TailwaterRating = (Q: number) => TailwaterAt;

/**
 * Builds TW(Q). Table: monotone cubic through the rows (Fritsch–Carlson), flagged outside;
 * Manning: bed + yn with Q = (1/n)·A·R^(2/3)·√S. [Chow 1959, §5-6; hydraulics.md §3]
 * @example makeTailwaterRating({ kind: 'manning', section: { shape: 'trapezoidal', bottomWidth: 10, sideSlope: 2 }, slope: 0.001, manningN: 0.035 }, 0)(50).depth // ≈ 2.511
 */
export function makeTailwaterRating(
  spec: TailwaterSpec,
  channelBedElevation: number,
): TailwaterRating {
  requireFinite('channelBedElevation', channelBedElevation);
  if (spec.kind === 'table') {
    const rows = spec.rows;
    if (!Array.isArray(rows))
      throw new InputError(
        'tailwater.rows',
        'invalid',
        'tailwater.rows must be a list of { Q, elevation }',
        {},
      );
    rows.forEach((r, i) => {
      requirePositive(`tailwater.rows[${i}].Q`, r.Q);
      requireFinite(`tailwater.rows[${i}].elevation`, r.elevation);
    });
    const f = createMonotoneInterpolant(
      rows.map((r) => r.Q),
      rows.map((r) => r.elevation),
      'tailwater rating table',
    );
    return (Q: number) => {
      requirePositive('Q', Q);
      const r = f(Q);
      return { elevation: r.value, depth: r.value - channelBedElevation, outside: r.outside };
    };
  }
  if (spec.kind === 'manning') {
    validateSection(spec.section);
    requirePositive('tailwater.slope', spec.slope);
    requirePositive('tailwater.manningN', spec.manningN);
    return (Q: number) => {
      requirePositive('Q', Q);
      const depth = _normalDepth(spec.section, Q, spec.slope, spec.manningN, 1);
      return { elevation: channelBedElevation + depth, depth, outside: null };
    };
  }
  throw new InputError(
    'tailwater.kind',
    'unknown-option',
    `tailwater.kind must be 'table' or 'manning'`,
    {},
  );
}
