import type { JumpResult, StudyResult } from '@basinwright/common';

// The engine never returns NaN; an infinite value cannot be written as JSON, so a
// non-finite number (none expected) becomes null rather than breaking the response.
function finite<T>(value: T): T {
  return JSON.parse(
    JSON.stringify(value, (_k, v: unknown) =>
      typeof v === 'number' && !Number.isFinite(v) ? null : v,
    ),
  ) as T;
}

/** JumpResult exactly as the engine names it (hydraulics.md), SI. */
export function presentJump(r: JumpResult): JumpResult {
  return {
    y1: r.y1,
    y2: r.y2,
    v1: r.v1,
    v2: r.v2,
    fr1: r.fr1,
    fr2: r.fr2,
    headLoss: r.headLoss,
    relativeLoss: r.relativeLoss,
    efficiency: r.efficiency,
    height: r.height,
    length: r.length,
    rollerLength: r.rollerLength,
    jumpClass: r.jumpClass,
    power: r.power,
  };
}

/** StudyResult, SI (m, m³/s, m/s, W); `input.displayUnits` says which units the user works in. */
export function presentStudy(r: StudyResult): StudyResult {
  return finite(r);
}
