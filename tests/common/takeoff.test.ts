// The take-off of a simple rectangular basin against a hand calculation written out below,
// volume by volume; the same quantities in SI and US customary; overrides and their schema.
import { describe, expect, it } from 'vitest';
import {
  TAKEOFF_ASSUMPTIONS,
  formatTakeoff,
  formatTakeoffTotals,
  runStudy,
  takeoff,
  takeoffOverridesSchema,
  takeoffOverridesToSI,
  type JumpBasinDesign,
  type Takeoff,
} from '@basinwright/common';
import { expectRel } from '../support/tolerance';
import { fenwickDesign } from '../../seed/designs';

/**
 * A plain rectangular basin (no blocks, no flare), 6 m wide inside, 20 m long, walls 4 m high
 * and 0.4 m thick, slab 0.5 m, a solid rectangular end sill 0.8 m high and 1.2 m long,
 * cutoffs 1.0 m and 1.5 m deep, wingwalls 4 m long, floor at 95.0 m, channel bed at 98.0 m,
 * riprap 0.6 m thick × 10 m × 6.8 m. Only the fields the take-off reads are given.
 */
const simpleBasin = {
  family: 'jump-basin',
  type: 'usbr-1',
  name: 'test basin',
  width: 6,
  length: 20,
  floorElevation: 95,
  channelBedElevation: 98,
  walls: { height: 4, thickness: 0.4 },
  slab: { thickness: 0.5 },
  endSill: { kind: 'solid', height: 0.8, length: 1.2, upstreamSlope: 0 },
  cutoffs: { upstream: { depth: 1.0, thickness: 0.4 }, downstream: { depth: 1.5, thickness: 0.4 } },
  wingwalls: { length: 4, height: 4, angleDeg: 45 },
  flare: null,
  riprap: { thickness: 0.6, length: 10, width: 6.8 },
  assumptions: [],
} as unknown as JumpBasinDesign;

const line = (t: Takeoff, key: string): number => {
  const l = t.lines.find((x) => x.key === key);
  if (!l) throw new Error(`no line ${key}`);
  return l.quantity;
};

describe('take-off of a simple rectangular basin (hand calculation)', () => {
  const t = takeoff(simpleBasin);
  // Defaults used by the hand calculation (assumptions.ts): waste 3 %, rebar 100/110/80/60
  // kg/m³ (slab/walls/sill/cutoffs), working room 0.6 m, granular soil 1.5:1, bedding 0.15 m,
  // stone 2,000 kg/m³, geotextile laps 15 %, joints every 9 m.
  const waste = 1.03;

  it('concrete by element, neat volume × 1.03', () => {
    // slab: 20 m × (6 + 2×0.4) m × 0.5 m = 20 × 6.8 × 0.5 = 68.0 m³
    expectRel(line(t, 'concrete.floorSlab'), 68.0 * waste, 1e-12);
    // side walls: 2 × 20 × 4 × 0.4 = 64.0 m³
    expectRel(line(t, 'concrete.sideWalls'), 64.0 * waste, 1e-12);
    // end sill: 0.8 × 1.2 × 6 = 5.76 m³ (a rectangle in section, across the inside width)
    expectRel(line(t, 'concrete.endSill'), 5.76 * waste, 1e-12);
    // cutoffs: (1.0 × 0.4 + 1.5 × 0.4) × 6.8 = 1.0 × 6.8 = 6.8 m³
    expectRel(line(t, 'concrete.cutoffWalls'), 6.8 * waste, 1e-12);
    // wingwalls: 2 × 4 m × mean height 2 m × 0.4 m = 6.4 m³
    expectRel(line(t, 'concrete.wingwalls'), 6.4 * waste, 1e-12);
    // total: 68 + 64 + 5.76 + 6.8 + 6.4 = 150.96 m³ neat
    expectRel(t.totals.concrete, 150.96 * waste, 1e-12);
    // no blocks, no transition in a plain basin
    expect(t.lines.some((l) => l.element === 'chuteBlocks' || l.element === 'transition')).toBe(
      false,
    );
  });

  it('reinforcement by element from the kg/m³ ratios (on neat volumes)', () => {
    expectRel(line(t, 'reinforcement.floorSlab'), 68.0 * 100, 1e-12); // 6,800 kg
    expectRel(line(t, 'reinforcement.sideWalls'), 64.0 * 110, 1e-12); // 7,040 kg
    expectRel(line(t, 'reinforcement.endSill'), 5.76 * 80, 1e-12); // 460.8 kg
    expectRel(line(t, 'reinforcement.cutoffWalls'), 6.8 * 60, 1e-12); // 408 kg
    expectRel(line(t, 'reinforcement.wingwalls'), 6.4 * 110, 1e-12); // 704 kg
    expectRel(t.totals.reinforcement, 15412.8, 1e-12); // 6800 + 7040 + 460.8 + 408 + 704
  });

  it('formwork by element', () => {
    // slab edges: perimeter 2 × (20 + 6.8) × 0.5 = 26.8 m²
    expectRel(line(t, 'formwork.floorSlab'), 26.8, 1e-12);
    // walls, both faces: 2 walls × 2 faces × 20 × 4 = 320 m²
    expectRel(line(t, 'formwork.sideWalls'), 320, 1e-12);
    // sill: upstream and downstream faces 2 × 0.8 × 6 = 9.6 m²
    expectRel(line(t, 'formwork.endSill'), 9.6, 1e-12);
    // wingwalls: 2 walls × 2 faces × 4 m × mean 2 m = 32 m²
    expectRel(line(t, 'formwork.wingwalls'), 32, 1e-12);
    // cutoffs are cast against the trench: no line
    expect(t.lines.some((l) => l.key === 'formwork.cutoffWalls')).toBe(false);
    expectRel(t.totals.formwork, 388.4, 1e-12);
  });

  it('excavation by the prismoidal formula, backfill, joints and waterstop', () => {
    // depth: channel bed 98.0 − slab underside (95.0 − 0.5) = 3.5 m
    // base: (20 + 2×0.6) × (6.8 + 2×0.6) = 21.2 × 8.0 = 169.6 m²
    // top: (21.2 + 2×1.5×3.5) × (8.0 + 10.5) = 31.7 × 18.5 = 586.45 m²
    // middle: 26.45 × 13.25 = 350.4625 m²
    // prismoidal formula: V = D/6 · (A1 + 4·Am + A2) = 3.5/6 × 2157.9 = 1258.775 m³
    const pit = (3.5 / 6) * (169.6 + 4 * 350.4625 + 586.45);
    expectRel(pit, 1258.775, 1e-12);
    // plus the cutoff trenches (filled with concrete): 6.8 m³
    expectRel(line(t, 'excavation.structure'), 1258.775 + 6.8, 1e-12);
    // backfill: pit − the structure's outline below the bed 20 × 6.8 × 3.5 = 476 → 782.775 m³
    expectRel(line(t, 'backfill.structure'), 782.775, 1e-12);
    // joints every 9 m over 20 m: 2 joints, each 6.8 + 2 × 4 = 14.8 m → 29.6 m
    expectRel(line(t, 'joint.structure'), 29.6, 1e-12);
    // waterstop: the joints 29.6 m + both wall-to-slab joints 2 × 20 m = 69.6 m
    expectRel(line(t, 'waterstop.structure'), 69.6, 1e-12);
  });

  it('riprap, bedding, geotextile and their excavation', () => {
    // area 10 × 6.8 = 68 m²; riprap 0.6 × 68 = 40.8 m³; at 2,000 kg/m³ 81,600 kg
    expectRel(line(t, 'riprap.exitProtection'), 40.8, 1e-12);
    expectRel(line(t, 'riprapMass.exitProtection'), 81600, 1e-12);
    // bedding 0.15 × 68 = 10.2 m³; geotextile 68 × 1.15 = 78.2 m²
    expectRel(line(t, 'bedding.exitProtection'), 10.2, 1e-12);
    expectRel(line(t, 'geotextile.exitProtection'), 78.2, 1e-12);
    // dug to set stone and bedding flush with the bed: (0.6 + 0.15) × 68 = 51 m³
    expectRel(line(t, 'excavation.exitProtection'), 51, 1e-12);
  });

  it('keys are stable kind.element pairs and every assumption is listed with a source', () => {
    for (const l of t.lines) expect(l.key).toBe(`${l.kind}.${l.element}`);
    expect(t.assumptions.map((a) => a.key).sort()).toEqual(Object.keys(TAKEOFF_ASSUMPTIONS).sort());
    for (const a of t.assumptions) {
      expect(a.source.length).toBeGreaterThan(0);
      expect(a.overridden).toBe(false);
    }
    // the design's own figures are the defaults of the thicknesses
    expect(t.assumptions.find((a) => a.key === 'slabThickness')!.value).toBe(0.5);
    expect(t.assumptions.find((a) => a.key === 'sideSlope')!.value).toBe(1.5);
  });

  it('overrides change the quantities they govern', () => {
    const o = takeoff(simpleBasin, { soil: 'rock', concreteWaste: 0, rebarSlab: 120 });
    expectRel(line(o, 'concrete.floorSlab'), 68.0, 1e-12);
    expectRel(line(o, 'reinforcement.floorSlab'), 68.0 * 120, 1e-12);
    // rock 0.25:1 → A2 = (21.2 + 1.75) × (8 + 1.75) = 22.95 × 9.75; Am = 22.075 × 8.875
    const pit = (3.5 / 6) * (169.6 + 4 * 22.075 * 8.875 + 22.95 * 9.75);
    expectRel(line(o, 'excavation.structure'), pit + 6.8, 1e-12);
    expect(o.assumptions.find((a) => a.key === 'rebarSlab')!.overridden).toBe(true);
    expect(() => takeoff(simpleBasin, { workingRoom: -1 })).toThrow(/workingRoom/);
  });
});

/**
 * A basin with chute blocks, baffle piers, a dentated sill with a sloping face and a flared
 * transition from a 2 m outlet: 6 m inside, 10 m long, walls 3 m × 0.3 m, slab 0.4 m.
 */
const blockedBasin = {
  ...simpleBasin,
  type: 'usbr-3',
  width: 6,
  length: 10,
  walls: { height: 3, thickness: 0.3 },
  slab: { thickness: 0.4 },
  chuteBlocks: { count: 4, height: 0.5, width: 0.5, length: 1.0 },
  baffleBlocks: { count: 3, height: 0.8, width: 0.6, length: 0.8, kind: 'baffle-piers' },
  endSill: { kind: 'dentated', height: 0.6, length: 1.5, upstreamSlope: 2 },
  flare: { fromWidth: 2, toWidth: 6, tanTheta: 0.1, angleDeg: 5.71, length: 20 },
} as unknown as JumpBasinDesign;

describe('take-off of blocks, piers, a sloping dentated sill and a transition (hand calculation)', () => {
  const t = takeoff(blockedBasin, { concreteWaste: 0 });
  it('blocks and piers as prisms (piers × 0.6 for their section)', () => {
    // 4 chute blocks 0.5 × 1.0 × 0.5 = 4 × 0.25 = 1.0 m³; forms 4 × (2×0.5×0.5 + 2×1.0×0.5) = 6.0 m²
    expectRel(line(t, 'concrete.chuteBlocks'), 1.0, 1e-12);
    expectRel(line(t, 'formwork.chuteBlocks'), 6.0, 1e-12);
    // 3 piers 0.6 wide × 0.8 long × 0.8 high × 0.6 = 3 × 0.2304 = 0.6912 m³
    expectRel(line(t, 'concrete.bafflePiers'), 0.6912, 1e-12);
    // forms 3 × (2 × 0.6 × 0.8 + 2 × 0.8 × 0.8 × 0.6) = 3 × 1.728 = 5.184 m²
    expectRel(line(t, 'formwork.bafflePiers'), 5.184, 1e-12);
    expectRel(line(t, 'reinforcement.bafflePiers'), 0.6912 * 80, 1e-12);
  });
  it('a dentated sill with a 2:1 upstream face', () => {
    // section: a trapezoid 0.6 high, 1.5 at the base, 1.5 − 2×0.6 = 0.3 at the top:
    // 0.6 × (1.5 + 0.3)/2 = 0.54 m²; × 6 m = 3.24 m³; × 0.6 for the teeth = 1.944 m³
    expectRel(line(t, 'concrete.endSill'), 1.944, 1e-12);
    // faces: downstream 0.6 high, upstream 0.6 × √(1 + 2²) = 1.3416 m along the slope;
    // (0.6 + 1.341641) × 6 × 0.6 = 6.989907 m²
    expectRel(line(t, 'formwork.endSill'), (0.6 + 0.6 * Math.sqrt(5)) * 6 * 0.6, 1e-12);
  });
  it('the transition: a trapezoidal floor and two flared walls', () => {
    // flare 20 m long from 2 m to 6 m; floor 20 × ((2 + 6)/2 + 2 × 0.3) × 0.4 = 20 × 4.6 × 0.4 = 36.8 m³
    // walls along the flare: 20 × √(1 + 0.1²) = 20.09975 m each; 2 × 20.09975 × 3 × 0.3 = 36.17955 m³
    const wallLen = 20 * Math.sqrt(1.01);
    expectRel(line(t, 'concrete.transition'), 36.8 + 2 * wallLen * 3 * 0.3, 1e-12);
    // floor at the slab ratio, walls at the wall ratio: 36.8 × 100 + 36.17955 × 110
    expectRel(line(t, 'reinforcement.transition'), 3680 + 2 * wallLen * 3 * 0.3 * 110, 1e-12);
    // forms: both faces of both walls 4 × 20.09975 × 3, and the floor's two side edges 2 × 20 × 0.4
    expectRel(line(t, 'formwork.transition'), 4 * wallLen * 3 + 16, 1e-12);
  });
  it('the structure is 30 m long with the transition: 3 joints', () => {
    // joints every 9 m over 10 + 20 = 30 m: 3; each 6.6 + 2 × 3 = 12.6 m → 37.8 m
    expectRel(line(t, 'joint.structure'), 37.8, 1e-12);
    // waterstop: 37.8 + 2 × 30 = 97.8 m
    expectRel(line(t, 'waterstop.structure'), 97.8, 1e-12);
  });
});

describe('SI and US customary give the same totals', () => {
  const result = runStudy(fenwickDesign);
  const t = takeoff(result.design!);
  // 1 yd³ = 0.764554857984 m³, 1 lb = 0.45359237 kg, 1 ft = 0.3048 m (exact definitions)
  const back: Record<string, number> = {
    'yd³': 0.764554857984,
    lb: 0.45359237,
    'ft²': 0.3048 * 0.3048,
    ft: 0.3048,
  };
  it('every line and total, shown in US units and converted back, equals the SI figure', () => {
    const us = formatTakeoff(t, 'US');
    const si = formatTakeoff(t, 'SI');
    us.forEach((l, i) => {
      expectRel(l.value * back[l.unit]!, si[i]!.value, 1e-12);
      expect(['yd³', 'lb', 'ft²', 'ft']).toContain(l.unit);
      expect(['m³', 'kg', 'm²', 'm']).toContain(si[i]!.unit);
    });
    const tu = formatTakeoffTotals(t, 'US');
    for (const [k, v] of Object.entries(tu))
      expectRel(v.value * back[v.unit]!, t.totals[k as keyof typeof t.totals], 1e-12);
  });
  it('overrides typed in US units give the SI take-off', () => {
    // 2 ft of working room = 0.6096 m; 168.55 lb/yd³ = 100.0 kg/m³ (1 lb/yd³ = 0.45359237/0.764554857984 kg/m³)
    const fromUS = takeoffOverridesToSI({ workingRoom: 2, rebarSlab: 168.55 }, 'US');
    expectRel(fromUS.workingRoom!, 0.6096, 1e-12);
    expectRel(fromUS.rebarSlab!, (168.55 * 0.45359237) / 0.764554857984, 1e-12);
    const a = takeoff(result.design!, fromUS);
    const b = takeoff(result.design!, {
      workingRoom: 0.6096,
      rebarSlab: (168.55 * 0.45359237) / 0.764554857984,
    });
    for (const k of Object.keys(a.totals) as Array<keyof typeof a.totals>)
      expectRel(a.totals[k], b.totals[k], 1e-12);
  });
  it('the schema checks overrides in the project units', async () => {
    const si = takeoffOverridesSchema('SI');
    const us = takeoffOverridesSchema('US');
    await expect(si.validate({ workingRoom: 6 })).rejects.toThrow(/at most 5 m/);
    await expect(us.validate({ workingRoom: 16 })).resolves.toEqual({ workingRoom: 16 }); // 4.88 m
    await expect(us.validate({ workingRoom: 17 })).rejects.toThrow(/ft/); // 5.18 m
    await expect(si.validate({ soil: 'sand' })).rejects.toThrow(/soil/);
    await expect(si.validate({ nonsense: 1 })).rejects.toThrow(/Unknown/);
    await expect(si.validate({ rebarWalls: 'lots' })).rejects.toThrow(/number/);
  });
});
