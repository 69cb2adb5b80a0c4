import { analyseRange, type StudyInput } from './common/src';
const demo = (count: number): StudyInput => ({
  units: 'SI', channelBedElevation: 90, basinWidth: 12, designDischarge: 85,
  discharges: { kind: 'range', min: 5, max: 85, count },
  tailwater: { kind: 'manning', section: { shape: 'trapezoidal', bottomWidth: 14, sideSlope: 2 }, slope: 0.0015, manningN: 0.03 },
  inflow: { kind: 'chute', crestElevation: 102, headwater: { kind: 'weir', C: 2.15, L: 12 }, lossModel: { kind: 'fraction', value: 0.1 } },
});
function t(f: () => void, n = 10) { for (let i=0;i<3;i++) f(); const t0 = performance.now(); for (let i=0;i<n;i++) f(); return (performance.now()-t0)/n; }
for (const c of [100, 200, 800, 3200]) { const inp = demo(c); console.log(c, t(() => analyseRange(inp, 87.6, 1)).toFixed(2)); }
