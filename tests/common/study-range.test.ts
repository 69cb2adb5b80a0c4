// The discharge range (issue 7, item 1): the design discharge is always analysed, impossible
// sites and steep tailwater channels are refused with a coded InputError, the floor solve copes
// with a margin that is not monotonic, the safety depth lowers the floor. Independent checks are
// written here (bisection, Bélanger, Manning), apart from the engine.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  G,
  InputError,
  MIN_FLOOR_FR1,
  fromSI,
  inputFromSI,
  jumpPosition,
  runStudy,
  toSI,
  type StudyInput,
} from '@basinwright/common';
import { expectRel } from '../support/tolerance';
import { bisect } from '../support/gvf-reference';
import { fenwickDesign } from '../../seed/designs';

// the demo project's design input (invented demo data, seed/designs.ts)
const demo: StudyInput = fenwickDesign;
const full = runStudy(demo);

/** The refusal thrown by f, checked to be a coded InputError (and still a RangeError). */
function refusal(f: () => unknown): InputError {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(RangeError);
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error('expected a refusal');
}

/** independent: the demo's y1 and y2 at Q on floor z (weir head, energy root by bisection, Bélanger) */
function demoJump(Q: number, z: number): { y1: number; y2: number } {
  const H = (Q / (2.15 * 12)) ** (2 / 3);
  const E = 0.9 * (102 + H - z);
  const q = Q / 12;
  const yc = Math.cbrt((q * q) / G);
  const y1 = bisect((y) => y + (q * q) / (2 * G * y * y) - E, 1e-6, yc);
  const fr = q / (y1 * Math.sqrt(G * y1));
  return { y1, y2: 0.5 * y1 * (Math.sqrt(1 + 8 * fr * fr) - 1) };
}

describe('the design discharge is always analysed', () => {
  it('count 1 gives the same floor as the full range, the design discharge added and said so', () => {
    const r = runStudy({ ...demo, discharges: { kind: 'range', min: 5, max: 85, count: 1 } });
    // regression baseline 87.63981433379968 m (tests/common/study-regression.test.ts)
    expectRel(r.floor.elevation, full.floor.elevation, 1e-9);
    expectRel(r.floor.elevation, 87.63981433379968, 1e-6);
    expect(r.rows.map((x) => x.Q)).toEqual([5, 85]);
    expect(r.designDischargeAdded).toBe(true);
    expect(r.rows[r.designIndex]!.Q).toBe(85);
    expect(r.designJump.position).not.toBe('swept-out');
    expect(r.warnings.find((w) => w.code === 'design-discharge-above-range')?.values.Q).toBe(85);
  });
  it('a list without the design discharge gives the same floor as the full range', () => {
    const r = runStudy({ ...demo, discharges: { kind: 'list', values: [5, 10] } });
    expectRel(r.floor.elevation, full.floor.elevation, 1e-9);
    expect(r.rows.map((x) => x.Q)).toEqual([5, 10, 85]);
    expect(r.floor.governingQ).toBe(85);
    expect(full.designDischargeAdded).toBe(false);
  });
  it('a design discharge above the checked range is analysed, not capped', () => {
    const r = runStudy({ ...demo, discharges: { kind: 'range', min: 5, max: 60, count: 12 } });
    expect(r.rows.at(-1)!.Q).toBe(85);
    expect(r.designJump.Q).toBe(85);
    expectRel(r.floor.elevation, full.floor.elevation, 1e-9);
    expect(r.warnings.find((w) => w.code === 'design-discharge-above-range')?.values.Q).toBe(85);
  });
  it('results at the design discharge are computed at it, never at the nearest row', () => {
    const r = runStudy({ ...demo, designDischarge: 82 }); // 82 is not on the 5-step grid
    expect(r.designJump.Q).toBe(82);
    const ref = demoJump(82, r.floor.elevation); // independent, above
    expectRel(r.designJump.jump.y1, ref.y1, 1e-8);
    expectRel(r.designJump.jump.y2, ref.y2, 1e-8);
    expectRel(r.rows[r.designIndex]!.y2, ref.y2, 1e-8);
    // the chosen basin is sized at the design discharge too
    if (r.design?.design.family !== 'jump-basin') throw new Error('expected a jump basin');
    expect(r.design.design.designQ).toBe(82);
  });
});

describe('impossible input is refused with its field and cause', () => {
  it('an input still in US customary units', () => {
    const e = refusal(() => runStudy({ ...demo, units: 'US' }));
    expect([e.field, e.code]).toEqual(['units', 'units-not-si']);
  });
  it('a crest below the channel bed, an outlet below it, an elevation far from the rest', () => {
    const chute = demo.inflow;
    if (chute.kind !== 'chute') throw new Error('the demo is a chute');
    const low = refusal(() => runStudy({ ...demo, inflow: { ...chute, crestElevation: 85 } }));
    expect([low.field, low.code]).toEqual(['inflow.crestElevation', 'below-bed']);
    const far = refusal(() => runStudy({ ...demo, inflow: { ...chute, crestElevation: 10200 } }));
    expect([far.field, far.code]).toEqual(['inflow.crestElevation', 'far-from-bed']);
    const pipe = refusal(() =>
      runStudy({
        ...demo,
        inflow: {
          kind: 'pipe',
          invertElevation: 89,
          outlet: {
            kind: 'table',
            rows: [
              { Q: 1, depth: 1, velocity: 5 },
              { Q: 100, depth: 2, velocity: 8 },
            ],
          },
        },
      }),
    );
    expect([pipe.field, pipe.code]).toEqual(['inflow.invertElevation', 'below-bed']);
  });
  it('a steep downstream channel (slope 0.05, n 0.013): supercritical tailwater, named discharge', () => {
    const e = refusal(() =>
      runStudy({
        ...demo,
        tailwater: { ...demo.tailwater, slope: 0.05, manningN: 0.013 } as StudyInput['tailwater'],
      }),
    );
    expect([e.field, e.code]).toEqual(['tailwater', 'supercritical-tailwater']);
    // independent: Manning normal depth by bisection in the trapezoid (b 14 m, z 2) at the
    // named discharge, and its Froude number V/√(gA/T) above 1 [Chow 1959]
    const Q = e.values.Q!;
    const A = (y: number) => 14 * y + 2 * y * y;
    const P = (y: number) => 14 + 2 * y * Math.sqrt(5);
    const yn = bisect(
      (y) => (1 / 0.013) * A(y) * (A(y) / P(y)) ** (2 / 3) * Math.sqrt(0.05) - Q,
      1e-4,
      20,
    );
    const fr = Q / A(yn) / Math.sqrt((G * A(yn)) / (14 + 4 * yn));
    expect(fr).toBeGreaterThan(1);
    expectRel(e.values.fr!, fr, 1e-6);
  });
  it('a gate opening too large for the small discharges is named', () => {
    const e = refusal(() => runStudy({ ...demo, inflow: { kind: 'gate', Cc: 0.61, opening: 3 } }));
    expect([e.field, e.code]).toEqual(['inflow.opening', 'gate-opening-too-large']);
    // independent: with the pool just touching the gate (y0 = a) the gate passes
    // q = Cc·a·√(2g·a)/√(1 + Cc) [Henderson 1966]; the named discharge is below that
    const qTouch = (0.61 * 3 * Math.sqrt(2 * G * 3)) / Math.sqrt(1 + 0.61);
    expect(e.values.Q! / 12).toBeLessThan(qTouch);
  });
});

describe('the floor solve when the margin is not monotonic in the floor', () => {
  // A weak inflow (b 10 m, Q 20 m³/s over a weir, C 1.7 m^½/s, L 10 m, crest 101 m, no loss) with
  // C = 2: near Fr1 1.7 the sequent depth grows faster than the floor drops, so the margin
  // TW − z − 2·y2 first falls then rises as the floor is lowered (invented case).
  const input: StudyInput = {
    units: 'SI',
    channelBedElevation: 100,
    basinWidth: 10,
    designDischarge: 20,
    discharges: { kind: 'list', values: [20] },
    tailwater: {
      kind: 'table',
      rows: [
        { Q: 10, elevation: 102.82 },
        { Q: 30, elevation: 103.02 },
      ],
    },
    inflow: {
      kind: 'chute',
      crestElevation: 101,
      headwater: { kind: 'weir', C: 1.7, L: 10 },
      lossModel: { kind: 'none' },
    },
    tailwaterFactor: 2,
  };
  /** independent: Fr1 and margin at floor z (weir head, energy root by bisection, Bélanger) */
  function at(z: number): { fr1: number; margin: number } {
    const q = 2;
    const E = 101 + (20 / 17) ** (2 / 3) - z;
    const yc = Math.cbrt((q * q) / G);
    if (E <= 1.5 * yc) return { fr1: 0, margin: -Infinity };
    const y1 = bisect((y) => y + (q * q) / (2 * G * y * y) - E, 1e-6, yc);
    const fr1 = q / (y1 * Math.sqrt(G * y1));
    const y2 = 0.5 * y1 * (Math.sqrt(1 + 8 * fr1 * fr1) - 1);
    return { fr1, margin: 102.92 - z - 2 * y2 }; // TW(20) = 102.92 m, the table's straight line
  }
  it('returns the highest floor with Fr1 ≥ 1.7 and the margin met, above a band that fails', () => {
    const r = runStudy(input);
    const z = r.floor.elevation;
    // independent scan down from the tailwater level in 1 mm steps
    let scan = NaN;
    for (let k = 0; k < 5000; k++) {
      const zk = 102.92 - k * 0.001;
      const a = at(zk);
      if (a.fr1 >= MIN_FLOOR_FR1 && a.margin >= 0) {
        scan = zk;
        break;
      }
    }
    expect(Math.abs(z - scan)).toBeLessThan(0.001);
    // the floor found is where Fr1 reaches the stated minimum (1.7)
    expectRel(at(z).fr1, MIN_FLOOR_FR1, 1e-6);
    // not monotonic: 0.2 m lower the margin fails, 0.5 m lower it holds again
    expect(at(z - 0.2).margin).toBeLessThan(0);
    expect(at(z - 0.5).margin).toBeGreaterThan(0);
  });
});

describe('the engineer sets the floor', () => {
  it('a safety depth below the solved floor lowers every floor by it; the margins follow', () => {
    const r = runStudy({ ...demo, floorSafetyDepth: 0.5 });
    expectRel(r.floor.elevation, full.floor.elevation - 0.5, 1e-12);
    expectRel(r.floor.requiredElevation!, full.floor.elevation, 1e-12);
    expect(r.floor.safetyDepth).toBe(0.5);
    for (const t of ['usbr-1', 'usbr-2', 'saf'] as const)
      expectRel(
        r.dissipators!.floors[t]!.elevation,
        full.dissipators!.floors[t]!.elevation - 0.5,
        1e-12,
      );
    // the governing discharge had zero margin; 0.5 m lower its tailwater is 0.5 m deeper
    // while y2 grows with the head (independent, demoJump)
    const ref = demoJump(85, r.floor.elevation);
    const tw = r.rows[r.designIndex]!.tailwaterElevation - r.floor.elevation;
    expectRel(r.rows[r.designIndex]!.margin, tw - ref.y2, 1e-8);
    expect(r.floor.leastMargin.margin).toBeGreaterThan(0);
  });
  it('a floor above the bed says so (height above the bed, not "0 m below")', () => {
    const r = runStudy({ ...demo, floorElevation: 90.3 });
    expect(r.floor.depthBelowBed).toBe(0);
    expectRel(r.floor.heightAboveBed, 0.3, 1e-9);
  });
});

describe('one rule for a drowned jump', () => {
  it('more than the tolerance above C·y2 drowns; short of it sweeps out (hydraulics.md §3)', () => {
    expect(jumpPosition(2.3, 2)).toBe('drowned'); // 15 % above, tolerance 10 % (common practice)
    expect(jumpPosition(2.1, 2)).toBe('at-toe');
    expect(jumpPosition(1.9, 2)).toBe('swept-out');
    const deep = runStudy({ ...demo, floorElevation: 80 });
    for (const row of deep.rows)
      expect(row.position).toBe(jumpPosition(row.tailwaterDepth, row.requiredDepth, 0.1));
  });
});

describe('units at the edge', () => {
  it('toSI is idempotent and runStudy refuses what it did not convert', () => {
    const us = inputFromSI(demo, 'US');
    expect(us.units).toBe('US');
    const si = toSI(us);
    expect(toSI(si)).toEqual(si);
    expect(si.units).toBe('SI');
    expect(() => runStudy(us)).toThrow(InputError);
  });
  it('property: the SI figures do not depend on the unit system the input was typed in', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 60, max: 110, noNaN: true }),
        fc.double({ min: 10, max: 16, noNaN: true }),
        (Qd, b) => {
          const si: StudyInput = { ...demo, designDischarge: Qd, basinWidth: b };
          const a = runStudy(si);
          const c = runStudy(toSI(inputFromSI(si, 'US')));
          expectRel(c.floor.elevation, a.floor.elevation, 1e-9);
          expectRel(c.designJump.jump.y2, a.designJump.jump.y2, 1e-9);
          expect(fromSI(c, 'SI')).toBe(c);
        },
      ),
      { numRuns: 8 },
    );
  });
});

describe("the chosen basin's own floor in the result", () => {
  it('carries the positions over the range and the design-discharge jump with its diagrams', () => {
    const own = full.chosenFloor!;
    expect(own.type).toBe('usbr-2'); // the demo's chosen basin (regression baseline)
    expectRel(own.floorElevation, 87.38061328399499, 1e-6); // regression baseline
    const ref = demoJump(85, own.floorElevation); // independent, above
    expectRel(own.designJump.jump.y1, ref.y1, 1e-8);
    expectRel(own.designJump.jump.y2, ref.y2, 1e-8);
    expect(own.designJump.diagrams).toBeDefined();
    expectRel(own.designJump.diagrams.y2, ref.y2, 1e-8);
    expect(own.positions).toHaveLength(full.rows.length);
    for (const p of own.positions)
      expect(p.position).toBe(jumpPosition(p.tailwaterDepth, p.requiredDepth, 0.1));
  });
});
