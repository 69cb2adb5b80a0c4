// Gradually varied flow by the direct step method (Chow 1959, §10-2) with Manning friction,
// and where a jump forms between a supercritical and a subcritical profile: the section where
// both have the same momentum function. SI units; x in metres, positive downstream.
import { InputError } from '../errors';
import { requireFinite, requireNonNegative, requirePositive } from './guards';
import {
  _criticalDepth,
  _energy,
  _frictionSlope,
  _froude,
  _momentum,
  _normalDepth,
  _supercriticalRoot,
} from './depths';
import { _conjugate } from './jump';
import { gateUpstreamDepth } from './inflow';
import { maxDepth, validateSection, type Section } from './sections';

export interface ProfilePoint {
  /** distance, m, positive downstream of the control the profile starts from */
  x: number;
  /** depth, m */
  y: number;
}

/** Number of depth steps of the direct step method: enough for ~1e-6 relative on a distance. */
const STEPS = 800;

/**
 * Direct step profile from depth yFrom at x = x0 to depth yTo, equal steps in depth:
 * Δx = ΔE / (S0 − S̄f), S̄f the mean of the step's ends. Caller makes sure the profile
 * really runs from yFrom to yTo without crossing normal or critical depth.
 */
export function directStepProfile(
  section: Section,
  Q: number,
  manningN: number,
  slope: number,
  yFrom: number,
  yTo: number,
  x0 = 0,
  steps = STEPS,
): ProfilePoint[] {
  validateSection(section);
  requirePositive('Q', Q);
  requirePositive('manningN', manningN);
  requireFinite('slope', slope);
  requirePositive('yFrom', yFrom);
  requirePositive('yTo', yTo);
  const pts: ProfilePoint[] = [{ x: x0, y: yFrom }];
  let x = x0;
  let y = yFrom;
  let e = _energy(section, Q, y);
  let sf = _frictionSlope(section, Q, y, manningN);
  const dy = (yTo - yFrom) / steps;
  for (let i = 1; i <= steps; i++) {
    const yn = i === steps ? yTo : yFrom + i * dy;
    const en = _energy(section, Q, yn);
    const sfn = _frictionSlope(section, Q, yn, manningN);
    const denom = slope - 0.5 * (sf + sfn);
    if (denom === 0)
      throw new InputError(
        'slope',
        'uniform-flow',
        'profile: the step reached normal depth (uniform flow)',
      );
    x += (en - e) / denom;
    y = yn;
    e = en;
    sf = sfn;
    pts.push({ x, y });
  }
  return pts;
}

/**
 * Distance only (no profile points) of the direct step from yFrom to yTo, with Richardson
 * extrapolation of two step counts (the method's error falls as 1/steps²): the fast path for
 * the whole-range study, accurate to about 1e-6 relative with 64 steps.
 */
export function _directStepDistance(
  section: Section,
  Q: number,
  n: number,
  slope: number,
  yFrom: number,
  yTo: number,
  steps = 64,
): number {
  const run = (k: number): number => {
    let x = 0;
    let e = _energy(section, Q, yFrom);
    let sf = _frictionSlope(section, Q, yFrom, n);
    const dy = (yTo - yFrom) / k;
    for (let i = 1; i <= k; i++) {
      const y = i === k ? yTo : yFrom + i * dy;
      const en = _energy(section, Q, y);
      const sfn = _frictionSlope(section, Q, y, n);
      x += (en - e) / (slope - 0.5 * (sf + sfn));
      e = en;
      sf = sfn;
    }
    return x;
  };
  return (4 * run(steps) - run(steps / 2)) / 3;
}

function normalDepthOrNull(section: Section, Q: number, slope: number, n: number): number | null {
  if (!(slope > 0)) return null;
  try {
    return _normalDepth(section, Q, slope, n, 1);
  } catch (e) {
    if (e instanceof RangeError) return null;
    throw e;
  }
}

interface ToeSolution {
  distance: number;
  yToe: number;
  profile: ProfilePoint[];
}

/** The fields a refusal of toeSolution names: the situation's own (the jump-position form's). */
interface ToeFields {
  slope: string;
  manningN: string;
  yStart: string;
  yDownstream: string;
}
const TOE_FIELDS: ToeFields = {
  slope: 'slope',
  manningN: 'manningN',
  yStart: 'yStart',
  yDownstream: 'yDownstream',
};

function toeSolution(
  section: Section,
  Q: number,
  manningN: number,
  slope: number,
  yStart: number,
  yDownstream: number,
  fields: ToeFields = TOE_FIELDS,
): ToeSolution {
  validateSection(section);
  requirePositive('Q', Q);
  requirePositive(fields.manningN, manningN);
  requireFinite(fields.slope, slope);
  requirePositive(fields.yStart, yStart);
  requirePositive(fields.yDownstream, yDownstream);
  if (yDownstream > maxDepth(section)) {
    throw new InputError(
      fields.yDownstream,
      'conduit-full',
      `${fields.yDownstream} ${yDownstream} m exceeds the conduit diameter`,
      { depth: yDownstream, diameter: maxDepth(section) },
    );
  }
  const yc = _criticalDepth(section, Q);
  if (!(yStart < yc)) {
    throw new InputError(
      fields.yStart,
      'not-supercritical',
      `${fields.yStart} ${yStart} m is not supercritical (critical depth ${yc.toPrecision(5)} m)`,
      { fr1: _froude(section, Q, yStart) },
    );
  }
  if (!(yDownstream > yc)) {
    // A depth typed is not subcritical; a reach's normal depth says the reach is not mild.
    throw new InputError(
      fields.yDownstream,
      /slope$/.test(fields.yDownstream) ? 'not-mild' : 'not-subcritical',
      `${fields.yDownstream} ${yDownstream} m is not subcritical (critical depth ${yc.toPrecision(5)} m): no jump can form against it`,
      { depth: yDownstream, yc },
    );
  }
  const yToe = _conjugate(section, Q, yDownstream, yc);
  if (yStart >= yToe) return { distance: 0, yToe, profile: [{ x: 0, y: yStart }] };
  const yn = normalDepthOrNull(section, Q, slope, manningN);
  if (yn !== null && yn < yc && yn <= yToe) {
    // Above or below normal depth, the supercritical flow of a steep reach tends to it and
    // never deepens to the toe depth the downstream depth needs.
    throw new InputError(
      fields.slope,
      'steep-no-jump',
      `${fields.slope}: the reach is steep (normal depth ${yn.toPrecision(4)} m < critical ${yc.toPrecision(4)} m) and the supercritical flow ` +
        `starting at ${yStart} m never deepens to ${yToe.toPrecision(4)} m: no jump forms on this reach`,
      { yn, yc, yToe },
    );
  }
  const profile = withSlopeField(fields.slope, () =>
    directStepProfile(section, Q, manningN, slope, yStart, yToe),
  );
  const distance = profile[profile.length - 1]!.x;
  return { distance, yToe, profile };
}

/** Runs a profile, a refusal of its step filed under the reach's own slope field. */
function withSlopeField<T>(field: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError && e.field === 'slope' && field !== 'slope')
      throw new InputError(field, e.code, e.message, { ...e.values }, { cause: e });
    throw e;
  }
}

/**
 * Distance (m) from the section where the supercritical depth is yStart (vena contracta,
 * toe of a chute) to the jump toe: the supercritical profile (M3/H3/A3, or S3 below a steep
 * normal depth) by the direct step method with Manning friction on bed slope `slope`
 * (0 = horizontal, negative = adverse) rises until its sequent depth equals yDownstream.
 * 0 when the jump is drowned (M(yStart) ≤ M(yDownstream)). RangeError when yStart is not
 * supercritical, yDownstream not subcritical, or a steep reach can never reach it.
 * [Chow 1959, §10-2 and §15-4]
 * @example jumpToeDistance({ shape: 'rectangular', width: 3 }, 6, 0.014, 0.0005, 0.15, 1.8) // metres
 */
export function jumpToeDistance(
  section: Section,
  Q: number,
  manningN: number,
  slope: number,
  yStart: number,
  yDownstream: number,
): number {
  return toeSolution(section, Q, manningN, slope, yStart, yDownstream).distance;
}

export type JumpSituation =
  /** a slope break from a steep reach (upstream) to a mild one (downstream) */
  | {
      kind: 'slopeBreak';
      section: Section;
      Q: number;
      upstream: { slope: number; manningN: number };
      downstream: { slope: number; manningN: number };
      /** depth far downstream; defaults to normal depth of the mild reach */
      tailwaterDepth?: number;
    }
  /** a sluice gate on a mild slope: jump on the M3 profile below the vena contracta */
  | {
      kind: 'gateMildSlope';
      section: Section;
      Q: number;
      opening: number;
      Cc: number;
      slope: number;
      manningN: number;
      tailwaterDepth?: number;
    }
  /** a gate on a steep slope: jump upstream of the gate on the S1 backwater */
  | {
      kind: 'gateSteepSlope';
      section: Section;
      Q: number;
      slope: number;
      manningN: number;
      /** depth just upstream of the gate; or give opening and Cc (rectangular channels) */
      upstreamDepth?: number;
      opening?: number;
      Cc?: number;
    }
  /** flow over an obstacle or weir crest (critical depth on the crest) onto a mild slope */
  | {
      kind: 'weirToMildSlope';
      section: Section;
      Q: number;
      /** crest height above the downstream bed, m */
      crestHeight: number;
      /** fraction of the energy at the toe lost on the face (default 0) */
      lossFraction?: number;
      slope: number;
      manningN: number;
      tailwaterDepth?: number;
    };

export interface JumpLocation {
  kind: JumpSituation['kind'];
  /** where the jump toe stands relative to the control */
  position: 'downstream' | 'upstream' | 'drowned' | 'at-structure';
  /** metres from the control (structure, break, vena contracta) to the jump toe, ≥ 0 */
  distance: number;
  /** depth at the jump toe (supercritical side), m */
  yToe: number;
  /** depth after the jump (subcritical side), m */
  ySequent: number;
  criticalDepth: number;
  /** supercritical profile, x positive downstream of the control */
  supercriticalProfile: ProfilePoint[];
  /** subcritical profile over the same reach */
  subcriticalProfile: ProfilePoint[];
  /** notes as data (phrased by jumpNoteText in common/src/messages) */
  notes: JumpNote[];
}

/** Stable codes of the jump-position notes. */
export type JumpNoteCode =
  /** the tailwater holds the jump against the structure */
  | 'drowned'
  /** the gate may run submerged: its free-flow discharge does not apply */
  | 'gate-submerged'
  /** the approach flow out-pushes the pool: the jump stands at the structure */
  | 'at-structure'
  /** the distance runs from the vena contracta (depth y1 = Cc·a) */
  | 'from-vena-contracta'
  /** the distance runs from the foot of the weir (depth y1) */
  | 'from-weir-foot';

/** A note of locateJump: its code and the SI lengths it quotes (y1, m). */
export interface JumpNote {
  code: JumpNoteCode;
  values: Partial<Record<'y1', number>>;
}

function mildNormal(
  section: Section,
  Q: number,
  slope: number,
  n: number,
  tw: number | undefined,
): number {
  if (tw !== undefined) return requirePositive('tailwaterDepth', tw);
  const yn = normalDepthOrNull(section, Q, slope, n);
  if (yn === null) {
    throw new InputError(
      'tailwaterDepth',
      'no-normal-depth',
      `tailwaterDepth is needed: the reach has no normal depth (slope ${slope})`,
      { slope },
    );
  }
  return yn;
}

function constantProfile(y: number, x0: number, x1: number): ProfilePoint[] {
  return [
    { x: x0, y },
    { x: x1, y },
  ];
}

/** Downstream case: supercritical from yStart at x = 0, subcritical yDown uniform beyond. */
function downstreamJump(
  s: Section,
  Q: number,
  n: number,
  slope: number,
  yStart: number,
  yDown: number,
  kind: JumpSituation['kind'],
  notes: JumpNote[],
  fields: ToeFields,
): JumpLocation {
  const yc = _criticalDepth(s, Q);
  const sol = toeSolution(s, Q, n, slope, yStart, yDown, fields);
  const drowned = sol.distance === 0;
  if (drowned) notes.push({ code: 'drowned', values: {} });
  const end = Math.max(sol.distance * 1.5, 1);
  return {
    kind,
    position: drowned ? 'drowned' : 'downstream',
    distance: sol.distance,
    yToe: drowned ? yStart : sol.yToe,
    ySequent: yDown,
    criticalDepth: yc,
    supercriticalProfile: sol.profile,
    subcriticalProfile: constantProfile(yDown, sol.distance, end),
    notes,
  };
}

/** Upstream case on a steep reach: S1 backwater from yControl at x = 0 up to the sequent of yn. */
function upstreamJump(
  s: Section,
  Q: number,
  n: number,
  slope: number,
  ynSteep: number,
  yControl: number,
  kind: JumpSituation['kind'],
  notes: JumpNote[],
  slopeField: string,
): JumpLocation {
  const yc = _criticalDepth(s, Q);
  const y2 = _conjugate(s, Q, ynSteep, yc);
  if (yControl <= y2) {
    notes.push({ code: 'at-structure', values: {} });
    return {
      kind,
      position: 'at-structure',
      distance: 0,
      yToe: ynSteep,
      ySequent: yControl,
      criticalDepth: yc,
      supercriticalProfile: constantProfile(ynSteep, -1, 0),
      subcriticalProfile: [{ x: 0, y: yControl }],
      notes,
    };
  }
  // Stepping from the control upstream: x comes out negative.
  const sub = withSlopeField(slopeField, () => directStepProfile(s, Q, n, slope, yControl, y2));
  const xJump = sub[sub.length - 1]!.x;
  if (!(xJump < 0))
    throw new InputError(
      slopeField,
      'not-backwater',
      `${slopeField}: the backwater profile does not run upstream (check the reach is steep)`,
    );
  return {
    kind,
    position: 'upstream',
    distance: -xJump,
    yToe: ynSteep,
    ySequent: y2,
    criticalDepth: yc,
    supercriticalProfile: constantProfile(ynSteep, Math.min(1.5 * xJump, -1), xJump),
    subcriticalProfile: sub.slice().reverse(),
    notes,
  };
}

/**
 * Where a jump forms in a channel: slope break steep→mild, gate on a mild slope, gate on a
 * steep slope, weir crest onto a mild slope. Both profiles come from their controls by the
 * direct step method; the jump stands where their momentum functions are equal.
 * [Chow 1959, §10 and §15-4; Henderson 1966, §6.3 for the gate]
 */
export function locateJump(situation: JumpSituation): JumpLocation {
  const s = situation.section;
  validateSection(s);
  const Q = requirePositive('Q', situation.Q);
  const yc = _criticalDepth(s, Q);
  const notes: JumpNote[] = [];
  switch (situation.kind) {
    case 'slopeBreak': {
      const up = situation.upstream;
      const dn = situation.downstream;
      requirePositive('upstream.slope', up.slope);
      requirePositive('upstream.manningN', up.manningN);
      requirePositive('downstream.manningN', dn.manningN);
      requireFinite('downstream.slope', dn.slope);
      const yn1 = normalDepthOrNull(s, Q, up.slope, up.manningN);
      if (yn1 === null || !(yn1 < yc)) {
        throw new InputError(
          'upstream.slope',
          'not-steep',
          'upstream.slope: the upstream reach is not steep (its normal depth is not supercritical)',
          yn1 === null ? { yc } : { depth: yn1, yc },
        );
      }
      const y3 = mildNormal(s, Q, dn.slope, dn.manningN, situation.tailwaterDepth);
      if (!(y3 > yc))
        throw new InputError(
          situation.tailwaterDepth !== undefined ? 'tailwaterDepth' : 'downstream.slope',
          situation.tailwaterDepth !== undefined ? 'not-subcritical' : 'not-mild',
          'downstream.slope: the downstream reach is not mild (its depth is not subcritical)',
          { depth: y3, yc },
        );
      if (_momentum(s, Q, yn1) > _momentum(s, Q, y3)) {
        return downstreamJump(s, Q, dn.manningN, dn.slope, yn1, y3, 'slopeBreak', notes, {
          slope: 'downstream.slope',
          manningN: 'downstream.manningN',
          yStart: 'upstream.slope',
          yDownstream: downstreamField(situation.tailwaterDepth, 'downstream.slope'),
        });
      }
      return upstreamJump(
        s,
        Q,
        up.manningN,
        up.slope,
        yn1,
        y3,
        'slopeBreak',
        notes,
        'upstream.slope',
      );
    }
    case 'gateMildSlope': {
      requirePositive('opening', situation.opening);
      requirePositive('Cc', situation.Cc);
      requirePositive('manningN', situation.manningN);
      const y1 = situation.Cc * situation.opening;
      if (!(y1 < yc))
        throw new InputError(
          'opening',
          'not-supercritical',
          'opening: the vena contracta depth Cc·a is not supercritical',
          { fr1: _froude(s, Q, y1) },
        );
      const yDown = mildNormal(s, Q, situation.slope, situation.manningN, situation.tailwaterDepth);
      notes.push({ code: 'from-vena-contracta', values: { y1 } });
      const r = downstreamJump(
        s,
        Q,
        situation.manningN,
        situation.slope,
        y1,
        yDown,
        'gateMildSlope',
        notes,
        {
          slope: 'slope',
          manningN: 'manningN',
          yStart: 'opening',
          yDownstream: downstreamField(situation.tailwaterDepth, 'slope'),
        },
      );
      if (r.position === 'drowned') notes.push({ code: 'gate-submerged', values: {} });
      return r;
    }
    case 'gateSteepSlope': {
      requirePositive('slope', situation.slope);
      requirePositive('manningN', situation.manningN);
      const yn = normalDepthOrNull(s, Q, situation.slope, situation.manningN);
      if (yn === null || !(yn < yc))
        throw new InputError(
          'slope',
          'not-steep',
          'slope: the reach is not steep (normal depth not supercritical)',
          yn === null ? { yc } : { depth: yn, yc },
        );
      let y0: number;
      if (situation.upstreamDepth !== undefined)
        y0 = requirePositive('upstreamDepth', situation.upstreamDepth);
      else {
        if (s.shape !== 'rectangular') {
          throw new InputError(
            'upstreamDepth',
            'needs-rectangular',
            'upstreamDepth is needed: the gate equation here is for rectangular channels',
          );
        }
        if (situation.opening === undefined || situation.Cc === undefined) {
          throw new InputError(
            'upstreamDepth',
            'missing',
            'upstreamDepth, or opening and Cc, must be given',
          );
        }
        const { opening, Cc } = situation;
        y0 = withGateFields(() => gateUpstreamDepth(Q / s.width, opening, Cc));
      }
      if (!(y0 > yc))
        throw new InputError(
          situation.upstreamDepth !== undefined ? 'upstreamDepth' : 'opening',
          'not-subcritical',
          'upstreamDepth: the depth above the gate is not subcritical',
          { depth: y0, yc },
        );
      return upstreamJump(
        s,
        Q,
        situation.manningN,
        situation.slope,
        yn,
        y0,
        'gateSteepSlope',
        notes,
        'slope',
      );
    }
    case 'weirToMildSlope': {
      requireNonNegative('crestHeight', situation.crestHeight);
      requirePositive('manningN', situation.manningN);
      const loss = situation.lossFraction ?? 0;
      if (!(loss >= 0 && loss < 0.95))
        throw new InputError('lossFraction', 'out-of-range', 'lossFraction must lie in [0, 0.95)', {
          value: loss,
          min: 0,
          max: 0.95,
        });
      const eToe = (situation.crestHeight + _energy(s, Q, yc)) * (1 - loss);
      const y1 = _supercriticalRoot(s, Q, eToe, yc);
      const fr1 = _froude(s, Q, y1);
      if (!(fr1 > 1)) {
        throw new InputError(
          'crestHeight',
          'not-supercritical',
          'crestHeight: the flow at the foot of the weir is not supercritical: no jump',
          { fr1 },
        );
      }
      const yDown = mildNormal(s, Q, situation.slope, situation.manningN, situation.tailwaterDepth);
      notes.push({ code: 'from-weir-foot', values: { y1 } });
      return downstreamJump(
        s,
        Q,
        situation.manningN,
        situation.slope,
        y1,
        yDown,
        'weirToMildSlope',
        notes,
        {
          slope: 'slope',
          manningN: 'manningN',
          yStart: 'crestHeight',
          yDownstream: downstreamField(situation.tailwaterDepth, 'slope'),
        },
      );
    }
    default:
      throw new InputError(
        'kind',
        'unknown-option',
        `situation.kind must be 'slopeBreak', 'gateMildSlope', 'gateSteepSlope' or 'weirToMildSlope'`,
      );
  }
}

/** The field behind the depth below a jump: the tailwater depth typed, or the reach's slope. */
const downstreamField = (tailwaterDepth: number | undefined, slope: string): string =>
  tailwaterDepth !== undefined ? 'tailwaterDepth' : slope;

/** The gate relation's refusals (named gate.opening, gate.Cc) filed as the situation's fields. */
function withGateFields<T>(f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError && e.field.startsWith('gate.'))
      throw new InputError(e.field.slice(5), e.code, e.message, { ...e.values }, { cause: e });
    throw e;
  }
}
