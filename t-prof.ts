import { analyseRange, type StudyInput } from './common/src';
const inp: StudyInput = { units: 'SI', channelBedElevation: 90, basinWidth: 12, designDischarge: 85,
  discharges: { kind: 'range', min: 5, max: 85, count: 800 },
  tailwater: { kind: 'manning', section: { shape: 'trapezoidal', bottomWidth: 14, sideSlope: 2 }, slope: 0.0015, manningN: 0.03 },
  inflow: { kind: 'chute', crestElevation: 102, headwater: { kind: 'weir', C: 2.15, L: 12 }, lossModel: { kind: 'fraction', value: 0.1 } } };
for (let i = 0; i < 100; i++) analyseRange(inp, 87.6, 1);
