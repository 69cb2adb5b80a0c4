// Screening at the edges of each published range (hydraulics.md §4). Sources beside each check.
import { describe, expect, it } from 'vitest';
import {
  DISSIPATOR_CATALOGUE,
  screenDissipators,
  type DischargeRow,
  type ScreeningContext,
  type TypeScreening,
} from '../../common/src/basins';
import { reasonText, screeningSummaryText } from '../../common/src/messages';
import { expectRel } from '../support/tolerance';

const g = 9.80665;
/** A consistent row from Fr1 and V1 [calc: y1 = V²/(g·Fr²), Bélanger], tailwater 1.08·y2 unless given (inside the 10 % submergence tolerance of range/position.ts for C 1.0 and 1.05). */
function row(fr1: number, v1: number, W = 10, twRatio = 1.08): DischargeRow {
  const y1 = (v1 * v1) / (g * fr1 * fr1);
  const q = v1 * y1;
  const y2 = (y1 * (Math.sqrt(1 + 8 * fr1 * fr1) - 1)) / 2;
  return { Q: q * W, q, y1, v1, fr1, y2, tailwaterDepth: twRatio * y2 };
}
const chute: ScreeningContext = { inflow: 'chute', width: 10 };
function screen(rows: DischargeRow[], ctx: ScreeningContext = chute): TypeScreening[] {
  return screenDissipators({ rows, context: ctx });
}
function status(s: TypeScreening[], type: string, criterion: string): string | undefined {
  return s.find((x) => x.type === type)?.criteria.find((c) => c.criterion === criterion)?.status;
}

describe('Froude-number edges', () => {
  it('Fr 1.7: SAF lower limit, inclusive [src: Blaisdell 1948]', () => {
    expect(status(screen([row(1.7, 5)]), 'saf', 'froude')).toBe('pass');
    expect(status(screen([row(1.69, 5)]), 'saf', 'froude')).toBe('fail');
  });
  it('Fr 2.5: Type IV lower limit [src: EM-25]; Type I oscillating from 2.5 [src: USBR classes via Chow]', () => {
    expect(status(screen([row(2.5, 5)]), 'usbr-4', 'froude')).toBe('pass');
    expect(status(screen([row(2.49, 5)]), 'usbr-4', 'froude')).toBe('fail');
    expect(status(screen([row(2.5, 5)]), 'usbr-1', 'froude')).toBe('warn');
    expect(status(screen([row(2.49, 5)]), 'usbr-1', 'froude')).toBe('pass');
  });
  it('Fr 4.5: Type IV upper, Types II and III lower limit [src: EM-25]', () => {
    const at = screen([row(4.5, 8)]);
    expect(status(at, 'usbr-4', 'froude')).toBe('pass');
    expect(status(at, 'usbr-2', 'froude')).toBe('pass');
    expect(status(at, 'usbr-3', 'froude')).toBe('pass');
    const below = screen([row(4.49, 8)]);
    expect(status(below, 'usbr-2', 'froude')).toBe('fail');
    expect(status(below, 'usbr-3', 'froude')).toBe('fail');
    expect(status(screen([row(4.51, 8)]), 'usbr-4', 'froude')).toBe('fail');
  });
  it('Fr 17: Type III [src: EM-25] and SAF [src: Blaisdell] upper limit; Type II has none [src: EM-25]', () => {
    const at = screen([row(17, 12)]);
    expect(status(at, 'usbr-3', 'froude')).toBe('pass');
    expect(status(at, 'saf', 'froude')).toBe('pass');
    const above = screen([row(17.01, 12)]);
    expect(status(above, 'usbr-3', 'froude')).toBe('fail');
    expect(status(above, 'saf', 'froude')).toBe('fail');
    expect(status(above, 'usbr-2', 'froude')).toBe('pass');
  });
});

describe('velocity edges', () => {
  // 50 ft/s = 15.24 m/s and 60 ft/s = 18.288 m/s exactly [NIST SP 811: 1 ft = 0.3048 m]
  it('V1 50 ft/s (15.24 m/s): Type III pass at it, warn above [src: EM-25]; SAF likewise (cavitation caution)', () => {
    expect(status(screen([row(8, 15.24)]), 'usbr-3', 'velocity')).toBe('pass');
    expect(status(screen([row(8, 15.25)]), 'usbr-3', 'velocity')).toBe('warn');
    expect(status(screen([row(8, 15.25)]), 'saf', 'velocity')).toBe('warn');
    const us = screenDissipators({ rows: [row(8, 15.25)], context: chute });
    const reason = us
      .find((x) => x.type === 'usbr-3')!
      .criteria.find((c) => c.criterion === 'velocity')!;
    expect(reason.code).toBe('piers-cavitation-risk');
    // 15.25 m/s = 50.03 ft/s: said against the limit as published, not with extra figures
    expect(reasonText(reason, 'US')).toMatch(/^V1 at the 50 ft\/s limit:/);
  });
  it('V1 60 ft/s (18.288 m/s): Type III warn at it, fail above [from memory: EM-25]; SAF fail above it [src: Blaisdell]', () => {
    expect(status(screen([row(8, 18.288)]), 'usbr-3', 'velocity')).toBe('warn');
    expect(status(screen([row(8, 18.3)]), 'usbr-3', 'velocity')).toBe('fail');
    expect(status(screen([row(8, 18.288)]), 'saf', 'velocity')).toBe('warn');
    expect(status(screen([row(8, 18.3)]), 'saf', 'velocity')).toBe('fail');
  });
  it('a high-velocity case steers away from Type III toward Type II [src: EM-25: Type II where velocity is too high for piers]', () => {
    const s = screen([row(8, 20), row(10, 21)]);
    const t3 = s.find((x) => x.type === 'usbr-3')!;
    expect(t3.verdict).toBe('unsuitable');
    expect(screeningSummaryText(t3, s)).toMatch(/cavitate/);
    expect(s[0]!.type).toBe('usbr-2');
    expect(s[0]!.verdict).toBe('recommended');
    // beyond 18 m/s a flip bucket is also flagged for a specialist study [from memory: EM-25]
    expect(s.find((x) => x.type === 'flip-bucket')!.verdict).toBe('specialist');
  });
});

describe('Type VI, Type IX, riprap apron', () => {
  const pipe: ScreeningContext = {
    inflow: 'pipe',
    width: 3,
    culvert: { shape: 'circular', rise: 1.2 },
  };
  const pipeRow = (Q: number, v: number): DischargeRow => {
    const y1 = 0.5;
    return { Q, q: Q / 3, y1, v1: v, fr1: v / Math.sqrt(g * y1), y2: 1.5, tailwaterDepth: 0.8 };
  };
  // 400 cfs = 400 × 0.3048³ m³/s = 11.3267386368 m³/s exactly [NIST SP 811]
  it('Type VI up to 400 cfs (11.33 m³/s) passes, above fails [src: HEC-14 §9.4]', () => {
    expect(status(screen([pipeRow(400 * 0.3048 ** 3, 6)], pipe), 'usbr-6', 'discharge')).toBe(
      'pass',
    );
    expect(status(screen([pipeRow(11.33, 6)], pipe), 'usbr-6', 'discharge')).toBe('fail');
    const us = screenDissipators({ rows: [pipeRow(11.33, 6)], context: pipe });
    const c = us
      .find((x) => x.type === 'usbr-6')!
      .criteria.find((x) => x.criterion === 'discharge')!;
    // 11.33 m³/s = 400.1 cfs: at the published limit to three figures
    expect(reasonText(c, 'US')).toMatch(/^Q at the 400 cfs limit of the type/);
    const well = screenDissipators({ rows: [pipeRow(14, 6)], context: pipe })
      .find((x) => x.type === 'usbr-6')!
      .criteria.find((x) => x.criterion === 'discharge')!;
    // 14 m³/s = 494 cfs [NIST SP 811: 1 ft = 0.3048 m]
    expect(reasonText(well, 'US')).toMatch(/^Q 494 cfs exceeds the 400 cfs of the type/);
  });
  it('Type VI velocity up to 50 ft/s (15.24 m/s) [src: HEC-14 §9.4]', () => {
    expect(status(screen([pipeRow(5, 15.24)], pipe), 'usbr-6', 'velocity')).toBe('pass');
    expect(status(screen([pipeRow(5, 15.25)], pipe), 'usbr-6', 'velocity')).toBe('fail');
  });
  // 60 cfs/ft = 60 × 0.3048² m²/s = 5.5741824 m²/s exactly [NIST SP 811]
  it('Type IX: q up to 60 cfs/ft (5.574 m²/s) [src: Design of Small Dams]; needs a near-critical approach (gate inflow fails)', () => {
    const r = { ...row(1.2, 3, 10), q: 5.5741824, Q: 55.741824 };
    expect(status(screen([r]), 'usbr-9', 'unitDischarge')).toBe('pass');
    expect(status(screen([{ ...r, q: 5.58, Q: 55.8 }]), 'usbr-9', 'unitDischarge')).toBe('fail');
    expect(status(screen([row(6, 10)], { inflow: 'gate', width: 10 }), 'usbr-9', 'froude')).toBe(
      'fail',
    );
  });
  it('riprap apron: culvert rise up to 1.5 m [src: HEC-14 ch. 10]; a chute fails the inflow criterion', () => {
    expect(status(screen([pipeRow(3, 4)], pipe), 'riprap-apron', 'culvertSize')).toBe('pass');
    expect(
      status(
        screen([pipeRow(3, 4)], { ...pipe, culvert: { shape: 'circular', rise: 1.51 } }),
        'riprap-apron',
        'culvertSize',
      ),
    ).toBe('fail');
    expect(status(screen([row(6, 10)]), 'riprap-apron', 'inflow')).toBe('fail');
  });
});

describe('tailwater, debris, verdicts and ranking', () => {
  it('tailwater short of C·y2 fails (sweep-out); excess at the largest discharge warns', () => {
    expect(status(screen([row(8, 12, 10, 0.95)]), 'usbr-3', 'tailwater')).toBe('fail');
    expect(status(screen([row(8, 12, 10, 1.5)]), 'usbr-3', 'tailwater')).toBe('warn');
    // Type II needs 1.05·y2 [from memory: EM-25]: 1.04·y2 is short
    expect(status(screen([row(8, 12, 10, 1.04)]), 'usbr-2', 'tailwater')).toBe('fail');
  });
  it('heavy debris fails Type III (piers catch it) [src: EM-25]', () => {
    expect(status(screen([row(8, 12)], { ...chute, debris: 'heavy' }), 'usbr-3', 'debris')).toBe(
      'fail',
    );
    expect(status(screen([row(8, 12)], { ...chute, debris: 'heavy' }), 'usbr-1', 'debris')).toBe(
      'pass',
    );
  });
  it('every type of the catalogue is screened with reasons; ranks are 1..n; one recommended', () => {
    const s = screen([row(6, 10), row(8, 12)]);
    expect(s.map((x) => x.type).sort()).toEqual(DISSIPATOR_CATALOGUE.map((m) => m.id).sort());
    expect(s.map((x) => x.rank)).toEqual(s.map((_, i) => i + 1));
    expect(s.filter((x) => x.verdict === 'recommended')).toHaveLength(1);
    for (const t of s) {
      expect(screeningSummaryText(t, s).length).toBeGreaterThan(10);
      for (const c of t.criteria) expect(reasonText(c).length).toBeGreaterThan(5);
      expect(t.perDischarge.length).toBe(2);
    }
    // Fr 6–8 at moderate velocity: Type III is the shorter suitable basin and ranks first [EM-25 lengths from memory]
    expect(s[0]!.type).toBe('usbr-3');
  });
  it('criteria report the discharge where the worst case occurs', () => {
    const s = screen([row(6, 10), row(20, 12)]);
    const f = s.find((x) => x.type === 'usbr-3')!.criteria.find((c) => c.criterion === 'froude')!;
    expect(f.status).toBe('fail');
    expectRel(f.atQ ?? NaN, row(20, 12).Q, 1e-9);
  });
  it('bad rows are refused with a RangeError', () => {
    expect(() => screen([{ ...row(6, 10), y1: -1 }])).toThrow(RangeError);
    expect(() => screenDissipators({ rows: [], context: { inflow: 'chute', width: 0 } })).toThrow(
      /width/,
    );
  });
});
