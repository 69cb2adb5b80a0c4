import { toeFromHead } from './common/src/hydraulics/inflow';
import { jumpFromDepths } from './common/src/hydraulics/jump';
import { _froude } from './common/src/hydraulics/depths';
const basin = { shape: 'rectangular' as const, width: 12 };
const N = 100000;
let t0 = performance.now(); let s = 0;
for (let i = 0; i < N; i++) { const Q = 5 + (80 * i) / N; const t = toeFromHead(Q / 12, 16 + Q / 40, { kind: 'fraction', value: 0.1 }); s += t.y1; }
console.log('toe', ((performance.now() - t0) / N * 1000).toFixed(2), 'us');
t0 = performance.now();
for (let i = 0; i < N; i++) { const Q = 5 + (80 * i) / N; const y1 = 0.03 + 0.4 * i / N; const fr = _froude(basin, Q, y1); const y2 = 0.5*y1*(Math.sqrt(1+8*fr*fr)-1); const j = jumpFromDepths(basin, Q, y1, y2, fr, { lengthMethod: 'usbr' }); s += j.length; }
console.log('jump', ((performance.now() - t0) / N * 1000).toFixed(2), 'us');
t0 = performance.now();
for (let i = 0; i < N; i++) { const o = { a: i, b: 2, c: 3, d: 4, e: 5, f: 6, g: 7, h: 8, i: 9, j: 10, k: 11, l: 12, m: 13, n: 14 }; const r = { ...o, Q: 1, q: 2, H0: 3, yc: 4, tw: 5, td: 6, to: null, tf: 1, rd: 2, m: 3, pos: 'a', sr: 1, sw: null, gate: null, notes: [] as string[] }; s += r.Q; }
console.log('spread', ((performance.now() - t0) / N * 1000).toFixed(2), 'us', s > 0);
