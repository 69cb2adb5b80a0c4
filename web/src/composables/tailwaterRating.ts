// The tailwater rating of a study as points for a chart (SI), from the engine's own rating.
import { makeTailwaterRating, type StudyResult } from '@basinwright/common';

/** Points of the rating, SI: a smooth curve over the discharges checked and the table's own span. */
export interface RatingPoints {
  curve: Array<{ Q: number; elevation: number }>;
  checked: Array<{ Q: number; elevation: number }>;
  table: Array<{ Q: number; elevation: number }>;
  bed: number;
  designQ: number;
  /** discharges of the study outside the table's span (the level is extrapolated there) */
  outside: number[];
}

/** The rating's points from a study result (SI), or null before there is one. */
export function ratingPoints(result: StudyResult | null, count = 80): RatingPoints | null {
  if (!result) return null;
  const input = result.input;
  const rating = makeTailwaterRating(input.tailwater, input.channelBedElevation);
  const table =
    input.tailwater.kind === 'table'
      ? input.tailwater.rows.map((r) => ({ Q: r.Q, elevation: r.elevation }))
      : [];
  const qs = [...result.rows.map((r) => r.Q), ...table.map((r) => r.Q)];
  const lo = Math.min(...qs);
  const hi = Math.max(...qs);
  const curve: RatingPoints['curve'] = [];
  for (let k = 0; k < count; k++) {
    const Q = lo + ((hi - lo) * k) / (count - 1);
    if (Q > 0) curve.push({ Q, elevation: rating(Q).elevation });
  }
  return {
    curve,
    checked: result.rows.map((r) => ({ Q: r.Q, elevation: r.tailwaterElevation })),
    table,
    bed: input.channelBedElevation,
    designQ: input.designDischarge,
    // Only a table has ends; a Manning rating holds at every discharge (no depth solve per row).
    outside:
      input.tailwater.kind === 'table'
        ? result.rows.filter((r) => rating(r.Q).outside !== null).map((r) => r.Q)
        : [],
  };
}
