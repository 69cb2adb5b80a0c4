// The whole-range study on the invented demo scenario (product.md), checked against an
// independent solution written here: weir head, energy root by bisection, Bélanger's sequent
// depth (Chow 1959, eq. 3-20) and Manning normal depth by bisection, all with g = 9.80665.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  G,
  STUDY_CAUTIONS,
  analyseRange,
  fromSI,
  gateFlow,
  runStudy,
  solveFloorElevation,
  studyWarningText,
  toSI,
  type StudyInput,
} from '@basinwright/common';
import { expectRel } from '../support/tolerance';
import { fenwickDesign } from '../../seed/designs';
import { bisect } from '../support/gvf-reference';

// the demo project's design input (invented demo data, seed/designs.ts)
const demo: StudyInput = fenwickDesign;

/** independent: the demo's y1, y2 and tailwater elevation at Q for floor z */
function reference(Q: number, z: number): { y1: number; y2: number; tw: number } {
  const H = (Q / (2.15 * 12)) ** (2 / 3);
  const E = 0.9 * (102 + H - z);
  const q = Q / 12;
  const yc = Math.cbrt((q * q) / G);
  const y1 = bisect((y) => y + (q * q) / (2 * G * y * y) - E, 1e-6, yc);
  const fr = q / (y1 * Math.sqrt(G * y1));
  const y2 = 0.5 * y1 * (Math.sqrt(1 + 8 * fr * fr) - 1);
  const A = (y: number) => 14 * y + 2 * y * y;
  const P = (y: number) => 14 + 2 * y * Math.sqrt(5);
  const yn = bisect(
    (y) => (1 / 0.03) * A(y) * (A(y) / P(y)) ** (2 / 3) * Math.sqrt(0.0015) - Q,
    1e-4,
    20,
  );
  return { y1, y2, tw: 90 + yn };
}

describe('runStudy on the demo scenario', () => {
  const r = runStudy(demo);

  it('the floor holds the jump at the governing discharge exactly, and at every other one', () => {
    const z = r.floor.elevation;
    const gov = reference(r.floor.governingQ!, z);
    expectRel(gov.tw - z, gov.y2, 1e-6); // tailwater = 1.0·y2 at the governing discharge
    for (const row of r.rows) {
      const ref = reference(row.Q, z);
      expectRel(row.y1, ref.y1, 1e-8);
      expectRel(row.y2, ref.y2, 1e-8);
      expectRel(row.tailwaterElevation, ref.tw, 1e-8);
      expect(ref.tw - z).toBeGreaterThanOrEqual(ref.y2 * (1 - 1e-6));
    }
    expect(r.floor.governingQ).toBe(85);
    // 1 cm higher and the governing discharge is swept out
    const higher = analyseRange(demo, z + 0.01, 1);
    expect(higher.find((x) => x.Q === 85)!.position).toBe('swept-out');
    expect(higher.find((x) => x.Q === 85)!.margin).toBeLessThan(0);
  });

  it('reports excavation, the design jump, per-row positions and the cautions', () => {
    expectRel(r.floor.depthBelowBed, 90 - r.floor.elevation, 1e-12);
    expectRel(
      r.floor.excavation.volume,
      r.floor.depthBelowBed * 12 * r.floor.excavation.length,
      1e-12,
    );
    expect(r.designJump.jump.jumpClass).toBe('steady');
    expectRel(r.designJump.jump.y2, reference(85, r.floor.elevation).y2, 1e-8);
    // product.md: at low flow Fr1 is far higher than at the design discharge
    expect(r.rows[0]!.fr1).toBeGreaterThan(25);
    for (const row of r.rows) {
      expectRel(row.margin, row.tailwaterDepth - row.y2, 1e-9);
      expect(['at-toe', 'drowned']).toContain(row.position);
      if (row.position === 'drowned') expect(row.submergenceRatio).toBeGreaterThan(0.1);
    }
    // hydraulics.md §7: inflow above 15 m/s calls for a cavitation check; the warning quotes the fastest row
    const fast = r.warnings.find((w) => w.code === 'high-inflow-velocity');
    expect(fast?.severity).toBe('warning');
    expect(fast?.values.v1).toBe(Math.max(...r.rows.map((x) => x.v1)));
    expect(fast?.kinds.v1).toBe('velocity');
    expect(studyWarningText(fast!, 'SI')).toMatch(/above 15 m\/s/);
    expect(r.cautions).toEqual([...STUDY_CAUTIONS]);
    const all = r.cautions.join(' ');
    for (const phrase of [
      /Concept level/,
      /model studies/,
      /licensed professional engineer/,
      /local codes/,
      /[Cc]avitation/,
      /[Ss]cour/,
      /[Uu]plift/,
      /[Ss]weep-out/,
    ]) {
      expect(all).toMatch(phrase);
    }
  });

  it('diagrams at the design discharge: ΔE equals the head loss, M1 = M2, E is least at yc', () => {
    const d = r.diagrams;
    expectRel(d.specificEnergy.deltaE, r.designJump.jump.headLoss, 1e-9);
    expectRel(d.momentum.M1, d.momentum.M2, 1e-9);
    const minE = Math.min(...d.specificEnergy.points.map((p) => p.value));
    expect(minE).toBeGreaterThanOrEqual(d.specificEnergy.minimum * (1 - 1e-12));
    expectRel(d.criticalDepth, Math.cbrt((85 / 12) ** 2 / G), 1e-9);
    expect(d.specificEnergy.points[0]!.y).toBeLessThan(d.y1);
    expect(d.specificEnergy.points.at(-1)!.y).toBeGreaterThan(d.y2);
  });
});

describe('floor elevation and positions', () => {
  it('known toe conditions: the floor is min over Q of (TW − C·y2) in closed form', () => {
    const input: StudyInput = {
      ...demo,
      discharges: { kind: 'list', values: [20, 50, 85] },
      inflow: { kind: 'known', toe: { y1: 0.45, v1: 85 / 12 / 0.45 } },
      tailwaterFactor: 1.05,
    };
    const f = solveFloorElevation(input, 1.05);
    const v1 = 85 / 12 / 0.45;
    const cands = [20, 50, 85].map((Q) => {
      const y1 = Q / 12 / v1;
      const fr = v1 / Math.sqrt(G * y1);
      return reference(Q, 0).tw - 1.05 * 0.5 * y1 * (Math.sqrt(1 + 8 * fr * fr) - 1);
    });
    expectRel(f.elevation, Math.min(...cands), 1e-7);
    expect(f.governingQ).toBe([20, 50, 85][cands.indexOf(Math.min(...cands))]);
  });

  it('a tailwater factor that varies with Fr1 (the basin sets it) is applied row by row', () => {
    // SAF-like (hydraulics.md §4, from memory), held at its Fr1 = 17 value above its range
    const C = (row: { fr1: number }) => {
      const f = Math.min(row.fr1, 17);
      return f < 5.5 ? 1.1 - f ** 2 / 120 : f <= 11 ? 0.85 : 1 - f ** 2 / 800;
    };
    const f = solveFloorElevation(demo, C);
    const rows = analyseRange(demo, f.elevation, C);
    for (const row of rows) {
      expectRel(row.tailwaterFactor, C(row), 1e-12);
      expect(row.margin).toBeGreaterThanOrEqual(-1e-5);
    }
    expect(Math.min(...rows.map((x) => x.margin))).toBeLessThan(1e-5);
  });

  it('a fixed floor too high: swept out, with the distance the toe moves and a warning', () => {
    const z = runStudy(demo).floor.elevation + 0.6;
    const r = runStudy({ ...demo, floorElevation: z });
    expect(r.floor.fixed).toBe(true);
    const swept = r.rows.filter((x) => x.position === 'swept-out');
    expect(swept.length).toBeGreaterThan(0);
    for (const s of swept) {
      expect(s.tailwaterDepth).toBeLessThan(s.y2);
      if (s.tailwaterDepth > s.yc) expect(s.sweepOutDistance).toBeGreaterThan(0);
    }
    const sweep = r.warnings.find((w) => w.code === 'sweep-out');
    expect(sweep?.values.count).toBe(swept.length);
    expect(sweep?.at?.Q).toBe(swept[0]!.Q);
    const above = r.warnings.find((w) => w.code === 'fixed-floor-above-required');
    expect(above?.values.floorElevation).toBe(z);
    expect(above?.values.requiredElevation).toBe(r.floor.requiredElevation);
  });

  it('a tailwater factor callback that returns nonsense is refused by name', () => {
    expect(() => solveFloorElevation(demo, () => -1)).toThrow(/tailwaterFactor/);
  });

  it('a fixed floor deep: drowned, with the submergence ratio (TW − y2)/y2', () => {
    const r = runStudy({ ...demo, floorElevation: 80 });
    for (const row of r.rows) {
      expect(row.position).toBe('drowned');
      expectRel(row.submergenceRatio, (row.tailwaterElevation - 80 - row.y2) / row.y2, 1e-12);
    }
    const sub = r.warnings.find((w) => w.code === 'excess-submergence');
    expect(sub?.values.count).toBe(r.rows.length);
    // the worst row: tailwater / required depth − 1, largest over the rows (computed here)
    const worst = Math.max(...r.rows.map((x) => x.tailwaterDepth / x.requiredDepth - 1));
    expectRel(sub!.values.excess!, worst, 1e-12);
  });

  it('tailwater table: monotone interpolation, discharges outside flagged', () => {
    const r = runStudy({
      ...demo,
      discharges: { kind: 'list', values: [5, 40, 85, 100] },
      tailwater: {
        kind: 'table',
        rows: [
          { Q: 5, elevation: 90.6 },
          { Q: 40, elevation: 91.6 },
          { Q: 85, elevation: 92.4 },
        ],
      },
    });
    expect(r.rows.find((x) => x.Q === 100)!.tailwaterOutside).toBe('above');
    expectRel(r.rows.find((x) => x.Q === 40)!.tailwaterElevation, 91.6, 1e-12);
    const ext = r.warnings.find((w) => w.code === 'tailwater-extended');
    expect(ext?.values).toEqual({ count: 1, Q: 100 });
  });

  it('sluice gate with a fixed opening: y1 = Cc·a and the upstream depth from the gate equation', () => {
    const r = runStudy({
      ...demo,
      discharges: { kind: 'list', values: [10, 20] },
      designDischarge: 20,
      inflow: { kind: 'gate', Cc: 0.61, opening: 0.5 },
    });
    for (const row of r.rows) {
      expectRel(row.y1, 0.305, 1e-12);
      const gf = gateFlow({ opening: 0.5, Cc: 0.61, upstreamDepth: row.gate!.upstreamDepth });
      expectRel(gf.q, row.Q / 12, 1e-9);
    }
  });

  it('pipe outlet from its barrel: energy at the outlet carried to the floor', () => {
    const r = runStudy({
      ...demo,
      basinWidth: 3,
      designDischarge: 4,
      discharges: { kind: 'list', values: [1, 4] },
      inflow: {
        kind: 'pipe',
        invertElevation: 91,
        outlet: {
          kind: 'barrel',
          section: { shape: 'circular', diameter: 1.5 },
          slope: 0.02,
          manningN: 0.013,
        },
      },
    });
    for (const row of r.rows) {
      expect(row.H0).not.toBeNull();
      expect(row.H0!).toBeGreaterThan(91 - r.floor.elevation);
      expect(row.margin).toBeGreaterThanOrEqual(-1e-5);
    }
    expect(r.warnings.some((w) => w.code === 'jet-flare')).toBe(true);
  });
});

describe('SI and US customary give the same answer', () => {
  const FT = 0.3048;
  const CFS = FT ** 3;
  // the demo typed in US units, converted here by hand with the standard factors
  const us: StudyInput = {
    units: 'US',
    channelBedElevation: 90 / FT,
    basinWidth: 12 / FT,
    designDischarge: 85 / CFS,
    discharges: { kind: 'range', min: 5 / CFS, max: 85 / CFS, count: 17 },
    tailwater: {
      kind: 'manning',
      section: { shape: 'trapezoidal', bottomWidth: 14 / FT, sideSlope: 2 },
      slope: 0.0015,
      manningN: 0.03,
    },
    inflow: {
      kind: 'chute',
      crestElevation: 102 / FT,
      headwater: { kind: 'weir', C: 2.15 / Math.sqrt(FT), L: 12 / FT }, // C in ft^0.5/s
      lossModel: { kind: 'fraction', value: 0.1 },
    },
  };
  it('the demo entered in ft and cfs gives the SI floor, depths and excavation', () => {
    const a = runStudy(demo);
    const b = runStudy(toSI(us));
    expectRel(b.floor.elevation, a.floor.elevation, 1e-9);
    b.rows.forEach((row, i) => expectRel(row.y2, a.rows[i]!.y2, 1e-9));
    const shown = fromSI(b, 'US');
    expectRel(shown.floor.elevation, a.floor.elevation / FT, 1e-9);
    expectRel(shown.floor.excavation.volume, a.floor.excavation.volume / 0.764554857984, 1e-9); // yd³
    expectRel(shown.rows[0]!.Q, 5 / CFS, 1e-9);
    expectRel(shown.rows[0]!.v1, a.rows[0]!.v1 / FT, 1e-9);
    expectRel(shown.rows[0]!.q, a.rows[0]!.q / FT ** 2, 1e-9);
    expect(shown.rows[0]!.fr1).toBe(b.rows[0]!.fr1); // dimensionless: untouched by fromSI
    expectRel(b.rows[0]!.fr1, a.rows[0]!.fr1, 1e-9);
  });
  it('property: any scaled problem gives the same answer in both systems', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.3, max: 3, noNaN: true }),
        fc.double({ min: 0.5, max: 2, noNaN: true }),
        (ks, kq) => {
          const si: StudyInput = {
            ...demo,
            basinWidth: 12 * ks,
            designDischarge: 85 * kq,
            discharges: { kind: 'list', values: [20 * kq, 85 * kq] },
          };
          const usIn: StudyInput = {
            ...us,
            basinWidth: (12 * ks) / FT,
            designDischarge: (85 * kq) / CFS,
            discharges: { kind: 'list', values: [(20 * kq) / CFS, (85 * kq) / CFS] },
          };
          expectRel(runStudy(toSI(usIn)).floor.elevation, runStudy(si).floor.elevation, 1e-8);
        },
      ),
      { numRuns: 25 },
    );
  });
});

describe('study input errors are RangeErrors naming the field', () => {
  const cases: Array<[string, StudyInput, RegExp]> = [
    ['basin width zero', { ...demo, basinWidth: 0 }, /basinWidth/],
    ['no discharges', { ...demo, discharges: { kind: 'list', values: [] } }, /discharges/],
    [
      'count not whole',
      { ...demo, discharges: { kind: 'range', min: 5, max: 85, count: 2.5 } },
      /discharges.count/,
    ],
    [
      'max below min',
      { ...demo, discharges: { kind: 'range', min: 50, max: 5, count: 3 } },
      /discharges.max/,
    ],
    [
      'gate with two settings',
      { ...demo, inflow: { kind: 'gate', Cc: 0.61, opening: 0.5, upstreamDepth: 3 } },
      /exactly one/,
    ],
    [
      'tailwater kind',
      { ...demo, tailwater: { kind: 'guess' } as unknown as StudyInput['tailwater'] },
      /tailwater/,
    ],
    [
      'inflow kind',
      { ...demo, inflow: { kind: 'magic' } as unknown as StudyInput['inflow'] },
      /inflow.kind/,
    ],
    ['units', { ...demo, units: 'imperial' as unknown as 'SI' }, /units/],
    [
      'known toe subcritical',
      { ...demo, inflow: { kind: 'known', toe: { y1: 3, v1: 1 } } },
      /not supercritical/,
    ],
    [
      'loss fraction',
      {
        ...demo,
        inflow: {
          ...demo.inflow,
          lossModel: { kind: 'fraction', value: 2 },
        } as StudyInput['inflow'],
      },
      /lossModel/,
    ],
    ['tailwater factor', { ...demo, tailwaterFactor: 5 }, /tailwaterFactor/],
  ];
  it.each(cases)('%s', (_n, input, msg) => {
    expect(() => runStudy(input)).toThrow(RangeError);
    expect(() => runStudy(input)).toThrow(msg);
  });
});

describe('sweep-out distance on the basin floor', () => {
  it('equals the public jumpToeDistance (800-step direct step) on the horizontal floor', async () => {
    const { jumpToeDistance } = await import('@basinwright/common');
    const z = runStudy(demo).floor.elevation + 0.6;
    const rows = analyseRange(demo, z, 1).filter(
      (r) => r.sweepOutDistance !== null && r.sweepOutDistance > 0,
    );
    expect(rows.length).toBeGreaterThan(0);
    for (const r of rows) {
      const d = jumpToeDistance(
        { shape: 'rectangular', width: 12 },
        r.Q,
        0.014,
        0,
        r.y1,
        r.tailwaterDepth,
      );
      expectRel(r.sweepOutDistance!, d, 1e-5);
    }
  });
});
