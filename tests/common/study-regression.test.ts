// Regression baseline for the study rebuild (issue 7): the floors and sizes of both demo designs
// (seed/designs.ts, invented demo data) as computed by runStudy at commit f0d8b66, before the
// discharge range was rebuilt. Source of the expected values: that earlier code, whose floors an
// independent implementation of the published relations (weir head, toe depth, Bélanger,
// Manning, the whole-range floor solve for USBR I, II, IV and SAF) matched within 4·10⁻⁶
// (issue 7, "Why"). The rebuild must reproduce them to 10⁻⁶.
import { describe, expect, it } from 'vitest';
import { runStudy, toSI, type StudyInput, type StudyResult } from '@basinwright/common';
import { expectRel } from '../support/tolerance';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';

interface Baseline {
  floor: number;
  governingQ: number;
  excavationLength: number;
  floors: Record<'usbr-1' | 'usbr-2' | 'usbr-3' | 'usbr-4' | 'saf', number>;
  chosen: string;
  entries: Array<{ type: string; length: number; wall: number; concrete: number; floor: number }>;
}

// regression baseline (runStudy at f0d8b66; floors checked independently, see above)
const FENWICK: Baseline = {
  floor: 87.63981433379968,
  governingQ: 85,
  excavationLength: 28.852433624374953,
  floors: {
    'usbr-1': 87.63981433379968,
    'usbr-2': 87.38061328399499,
    'usbr-3': 87.63981433379968,
    'usbr-4': 87.11937518585046,
    saf: 88.40505786407311,
  },
  chosen: 'usbr-2',
  entries: [
    {
      type: 'usbr-2',
      length: 19.78825399869127,
      wall: 7.2,
      concrete: 808.0096034324694,
      floor: 87.38061328399499,
    },
    {
      type: 'usbr-1',
      length: 28.852433624374953,
      wall: 6.9,
      concrete: 1031.412207831386,
      floor: 87.63981433379968,
    },
  ],
};

// regression baseline (runStudy at f0d8b66, the US demo through toSI; SI figures)
const CALDWELL: Baseline = {
  floor: 92.25293115462041,
  governingQ: 11.893075568640002, // 420 cfs
  excavationLength: 17.401567469920597,
  floors: {
    'usbr-1': 92.25293115462041,
    'usbr-2': 92.07212213362432,
    'usbr-3': 92.25293115462041,
    'usbr-4': 91.888696230304,
    saf: 92.48888543928838,
  },
  chosen: 'saf',
  entries: [
    {
      type: 'saf',
      length: 4.17139979160281,
      wall: 3.7,
      concrete: 50.99016947805044,
      floor: 92.48888543928838,
    },
    {
      type: 'usbr-3',
      length: 6.788814400328916,
      wall: 4.25,
      concrete: 80.73845120292133,
      floor: 92.25293115462041,
    },
    {
      type: 'usbr-2',
      length: 11.905975766468686,
      wall: 4.45,
      concrete: 111.10771494593428,
      floor: 92.07212213362432,
    },
    {
      type: 'usbr-1',
      length: 17.401567469920597,
      wall: 4.25,
      concrete: 130.438140782878,
      floor: 92.25293115462041,
    },
  ],
};

function check(r: StudyResult, b: Baseline): void {
  expectRel(r.floor.elevation, b.floor, 1e-6);
  expectRel(r.floor.requiredElevation!, b.floor, 1e-6);
  expectRel(r.floor.governingQ!, b.governingQ, 1e-9);
  expectRel(r.floor.excavation.length, b.excavationLength, 1e-6);
  for (const [type, z] of Object.entries(b.floors)) {
    expectRel(r.dissipators!.floors[type as keyof Baseline['floors']]!.elevation, z, 1e-6);
  }
  expect(r.dissipators!.chosen).toBe(b.chosen);
  const entries = [r.design, ...r.alternatives].filter((e) => e !== null);
  expect(entries.map((e) => e.type)).toEqual(b.entries.map((e) => e.type));
  for (const [i, e] of entries.entries()) {
    const want = b.entries[i]!;
    const d = e.design;
    if (d.family !== 'jump-basin') throw new Error(`${e.type}: expected a jump basin`);
    expectRel(d.length, want.length, 1e-6);
    expectRel(d.walls.height, want.wall, 1e-6);
    expectRel(d.concrete.total, want.concrete, 1e-6);
    expectRel(d.floorElevation, want.floor, 1e-6);
  }
}

describe('the demo designs keep their floors and sizes (regression baseline)', () => {
  it('Fenwick Mill Pond (SI demo)', () => {
    check(runStudy(fenwickDesign), FENWICK);
  });
  it('Caldwell Run (US demo, run in SI)', () => {
    check(runStudy(toSI(caldwellDesign) as StudyInput), CALDWELL);
  });
});
