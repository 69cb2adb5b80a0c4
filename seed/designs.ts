import type { StudyInput } from '@basinwright/common';

// Demo design inputs for the invented demo projects (product.md). Every number here is
// invented demo data, in the project's own units.

/** "Fenwick Mill Pond — auxiliary spillway outlet" (SI): the scenario of the product brief. */
export const fenwickDesign: StudyInput = {
  units: 'SI',
  channelBedElevation: 90,
  basinWidth: 12,
  designDischarge: 85,
  discharges: { kind: 'range', min: 5, max: 85, count: 17 },
  tailwater: {
    kind: 'manning',
    section: { shape: 'trapezoidal', bottomWidth: 14, sideSlope: 2 },
    slope: 0.0015,
    manningN: 0.03,
  },
  inflow: {
    kind: 'chute',
    crestElevation: 102,
    headwater: { kind: 'weir', C: 2.15, L: 12 },
    lossModel: { kind: 'fraction', value: 0.1 },
  },
};

/** "Caldwell Run culvert outlet" (US customary): a 6 ft × 6 ft box at 420 cfs (invented). */
export const caldwellDesign: StudyInput = {
  units: 'US',
  channelBedElevation: 308,
  basinWidth: 8,
  designDischarge: 420,
  discharges: { kind: 'range', min: 40, max: 420, count: 20 },
  tailwater: {
    kind: 'manning',
    section: { shape: 'trapezoidal', bottomWidth: 10, sideSlope: 2 },
    slope: 0.004,
    manningN: 0.035,
  },
  inflow: {
    kind: 'pipe',
    invertElevation: 310,
    outlet: {
      kind: 'barrel',
      section: { shape: 'rectangular', width: 6 },
      slope: 0.02,
      manningN: 0.012,
    },
    lossModel: { kind: 'none' },
  },
};

export const demoDesigns: { projectName: string; input: StudyInput }[] = [
  { projectName: 'Fenwick Mill Pond — auxiliary spillway outlet', input: fenwickDesign },
  { projectName: 'Caldwell Run culvert outlet', input: caldwellDesign },
];
