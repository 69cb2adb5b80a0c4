// The "Where the jump forms" page: the distance it shows is checked against an independent
// solution written here, the same as tests/common/hydraulics-profiles.test.ts uses — the
// profile equation dy/dx = (S0 − Sf)/(1 − Fr²) (Chow 1959, eq. 9-13) integrated in x by
// classical Runge–Kutta with 1 cm steps, the jump placed where the momentum function
// M = Q²/(gA) + A·ȳ of the supercritical depth equals that of the subcritical one (Chow 1959,
// §3-6). The engine steps in depth (direct step method): a different discretisation of the
// same physics. The inputs are those hand-checked cases (rectangular channel 3 m wide, 6 m³/s).
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import { G } from '@basinwright/common';
import JumpPositionView from '../../web/src/views/JumpPositionView.vue';
import JumpPositionChart from '../../web/src/components/JumpPositionChart.vue';
import AppShell from '../../web/src/components/AppShell.vue';
import { createAppRouter } from '../../web/src/router';
import { TOKEN_KEY } from '../../web/src/stores/auth';
import { expectRel } from '../support/tolerance';
import { M, bisect, critical, normal, rk4Until, type Chan } from '../support/gvf-reference';
import { demoFirm, demoUser, stubApi } from './fetch-stub';

// ---- the independent reference: a rectangular channel, SI, g = 9.80665 m/s² (the engine's) ----
const mom = M;
/** the depth of equal momentum on the supercritical / subcritical side of y */
const superConj = (c: Chan, y: number) => bisect((x) => mom(c, x) - mom(c, y), 1e-5, critical(c));
const subConj = (c: Chan, y: number) => bisect((x) => mom(c, x) - mom(c, y), critical(c), 50);
const chan = (S0: number): Chan => ({ b: 3, z: 0, n: 0.014, S0, Q: 6 });

/** Slope break 0.08 → 0.001: the M3 profile from the steep normal depth to the toe. */
function slopeBreakReference() {
  const up = chan(0.08);
  const dn = chan(0.001);
  const yn1 = normal(up);
  const yn2 = normal(dn);
  const target = mom(dn, yn2);
  return {
    x: rk4Until(dn, yn1, 0.01, (y) => target - mom(dn, y)),
    yToe: superConj(dn, yn2),
    ySequent: yn2,
    yc: critical(dn),
  };
}
/** Sluice gate a = 0.3 m, Cc = 0.61 on S0 = 0.0005: the M3 profile from the vena contracta Cc·a. */
function gateMildReference() {
  const c = chan(0.0005);
  const target = mom(c, normal(c));
  return { x: rk4Until(c, 0.61 * 0.3, 0.01, (y) => target - mom(c, y)), ySequent: normal(c) };
}
/** Gate a = 0.3 m, Cc = 0.61 on S0 = 0.02: the S1 backwater from the gate pool, stepped upstream. */
function gateSteepReference() {
  const c = chan(0.02);
  // the pool above the gate from q = Cd·a·√(2g·y0), Cd = Cc/√(1 + Cc·a/y0) [Henderson 1966, §6.3]
  const y0 = bisect(
    (y) => (0.61 / Math.sqrt(1 + (0.61 * 0.3) / y)) * 0.3 * Math.sqrt(2 * G * y) - 2,
    0.31,
    50,
  );
  const y2 = subConj(c, normal(c));
  return { x: -rk4Until(c, y0, -0.01, (y) => y2 - y) };
}

// 1 ft = 0.3048 m exactly [NIST SP 811]; 1 cfs = 0.3048³ m³/s.
const FT = 0.3048;

// ---- mounting the page as a signed-in member ----
// echarts needs a laid-out page, which jsdom has not: a stand-in takes the chart's option.
vi.mock('vue-echarts', async () => {
  const { defineComponent, h } = await import('vue');
  return {
    default: defineComponent({
      name: 'ChartStandIn',
      props: { option: { type: Object, required: true } },
      setup: () => () => h('div'),
    }),
  };
});
afterEach(() => vi.unstubAllGlobals());

interface ChartOption {
  xAxis: { name: string };
  yAxis: { name: string };
  series: Array<{ name: string; data: Array<[number, number]> }>;
}
const chartOption = (w: VueWrapper) =>
  w.findComponent({ name: 'ChartStandIn' }).props('option') as ChartOption;

async function mountPage(role: 'engineer' | 'viewer' = 'engineer') {
  localStorage.setItem(TOKEN_KEY, `tok-${role}`);
  setActivePinia(createPinia());
  const api = stubApi({
    'GET /auth/me': { status: 200, body: { user: demoUser(role), firm: demoFirm } },
  });
  const router = createAppRouter(createMemoryHistory());
  await router.push('/tools/jump-position');
  const wrapper = mount(JumpPositionView, {
    global: { plugins: [router] },
    attachTo: document.body,
  });
  await vi.waitFor(() => expect(wrapper.find('[data-test="jump-sentence"]').exists()).toBe(true));
  await flushPromises();
  return { wrapper, api, router };
}

const idOf = (path: string) => `#jump-${path.replace(/\./g, '-')}`;

/** Types into number boxes, then waits for the page's pause in typing to pass. */
async function type(w: VueWrapper, fields: Record<string, number | string>): Promise<void> {
  for (const [path, value] of Object.entries(fields)) {
    const input = w.find<HTMLInputElement>(idOf(path));
    expect(input.exists(), `field ${path}`).toBe(true);
    await input.setValue(String(value));
    await input.trigger('blur');
  }
  await settle(w);
}

async function settle(w: VueWrapper): Promise<void> {
  await flushPromises();
  await vi.waitFor(
    () => expect(w.find('[data-test="jump-result"] .pending').exists()).toBe(false),
    { timeout: 3000 },
  );
  await flushPromises();
}

async function pickKind(w: VueWrapper, kind: string): Promise<void> {
  await w.find(`[data-test="jump-kind-${kind}"] input`).setValue(true);
  await flushPromises();
}

async function pickUnits(w: VueWrapper, units: 'SI' | 'US'): Promise<void> {
  await w.find(`[data-test="jump-units"] input[value="${units}"]`).setValue(true);
  await flushPromises();
}

/** "1,234.56 ft" → { value: 1234.56, unit: 'ft' } */
function shown(w: VueWrapper, test: string): { value: number; unit: string } {
  const text = w.find(`[data-test="${test}"]`).text();
  const m = /^(-?[\d,]+(?:\.\d+)?) (\S+)$/.exec(text.trim());
  expect(m, `a number with its unit in ${test}: ${JSON.stringify(text)}`).not.toBeNull();
  return { value: Number(m![1]!.replace(/,/g, '')), unit: m![2]! };
}

/** The shown distance is rounded to 0.01: the reference's own 5e-4 plus half a last digit. */
const shownTol = (expected: number) => 5e-4 + 0.005 / expected;

const rect3Slopes = { 'section.width': 3, Q: 6 };

describe('Where the jump forms — the page', () => {
  it('opens on the starting example with a result, a chart and the caution, and asks the API nothing', async () => {
    const { wrapper, api } = await mountPage();
    expect(wrapper.find('h1').text()).toContain('Where the jump forms');
    expect(wrapper.find('[data-test="jump-error"]').exists()).toBe(false);
    expect(shown(wrapper, 'jump-distance').unit).toBe('m');
    expect(shown(wrapper, 'jump-distance').value).toBeGreaterThan(0);
    expect(wrapper.find('[data-test="cautions"]').text()).toContain('Concept level only.');
    expect(wrapper.find('[data-test="cautions"]').text()).toContain(
      'licensed professional engineer',
    );
    await vi.waitFor(() => expect(wrapper.findComponent(JumpPositionChart).exists()).toBe(true));
    await vi.waitFor(() => expect(wrapper.find('[data-test="jump-chart"]').exists()).toBe(true));
    // Only the sign-in check of the router; the calculation runs in the browser.
    expect(api.calls.map((c) => `${c.method} ${c.path}`)).toEqual(['GET /auth/me']);
    wrapper.unmount();
  });

  it('slope break 0.08 → 0.001: the distance, depths and chart agree with the RK4 reference', async () => {
    const ref = slopeBreakReference();
    const { wrapper } = await mountPage();
    await type(wrapper, {
      ...rect3Slopes,
      'upstream.slope': 0.08,
      'upstream.manningN': 0.014,
      'downstream.slope': 0.001,
      'downstream.manningN': 0.014,
    });
    expect(wrapper.find('[data-test="jump-error"]').exists()).toBe(false);
    const d = shown(wrapper, 'jump-distance');
    expect(d.unit).toBe('m');
    expectRel(d.value, ref.x, shownTol(ref.x)); // ≈ 42.4 m, RK4 reference above
    expect(wrapper.find('[data-test="jump-sentence"]').text()).toBe(
      `The jump forms ${d.value.toFixed(2)} m downstream of the slope break.`,
    );
    expect(wrapper.find('[data-test="jump-place"]').text()).toBe('Downstream of the control');
    // depths to 0.001 m: normal depth of the mild reach (Manning), its supercritical conjugate, yc = (q²/g)^(1/3)
    expectRel(shown(wrapper, 'jump-sequent-depth').value, ref.ySequent, 0.0005 / ref.ySequent);
    expectRel(shown(wrapper, 'jump-toe-depth').value, ref.yToe, 0.0005 / ref.yToe);
    expectRel(shown(wrapper, 'jump-critical-depth').value, ref.yc, 0.0005 / ref.yc);
    // the chart: depth against distance with units on both axes; the supercritical profile
    // ends at the toe marker, the subcritical one starts there, the critical line is yc
    const option = chartOption(wrapper);
    expect(option.xAxis.name).toBe('Distance x from the control, downstream positive (m)');
    expect(option.yAxis.name).toBe('Depth y (m)');
    const series = Object.fromEntries(option.series.map((s) => [s.name, s.data]));
    expect(Object.keys(series)).toEqual([
      'Supercritical profile',
      'Subcritical profile',
      'Critical depth yc',
      'Jump toe',
    ]);
    expectRel(series['Jump toe']![0]![0], ref.x, 5e-4);
    expectRel(series['Supercritical profile']!.at(-1)![0], ref.x, 5e-4);
    expectRel(series['Supercritical profile']![0]![1], normal(chan(0.08)), 1e-6); // starts at the steep normal depth
    expectRel(series['Subcritical profile']![0]![1], ref.ySequent, 1e-6);
    expectRel(series['Critical depth yc']![0]![1], ref.yc, 1e-6);
    wrapper.unmount();
  });

  it('sluice gate on a mild slope: the distance from the vena contracta agrees with the RK4 reference', async () => {
    const ref = gateMildReference();
    const { wrapper } = await mountPage();
    await pickKind(wrapper, 'gateMildSlope');
    await type(wrapper, { ...rect3Slopes, opening: 0.3, Cc: 0.61, slope: 0.0005, manningN: 0.014 });
    const d = shown(wrapper, 'jump-distance');
    expectRel(d.value, ref.x, shownTol(ref.x)); // ≈ 29.4 m, RK4 reference above
    expect(wrapper.find('[data-test="jump-sentence"]').text()).toContain(
      'downstream of the vena contracta below the gate',
    );
    expectRel(shown(wrapper, 'jump-sequent-depth').value, ref.ySequent, 0.0005 / ref.ySequent);
    expect(wrapper.find('[data-test="jump-notes"]').text()).toContain(
      'Distance measured from the vena contracta',
    );
    wrapper.unmount();
  });

  it('gate on a steep slope: the jump stands upstream of the gate, at the distance of the RK4 reference', async () => {
    const ref = gateSteepReference();
    const { wrapper } = await mountPage();
    await pickKind(wrapper, 'gateSteepSlope');
    await type(wrapper, { ...rect3Slopes, slope: 0.02, manningN: 0.014, opening: 0.3, Cc: 0.61 });
    const d = shown(wrapper, 'jump-distance');
    expectRel(d.value, ref.x, shownTol(ref.x)); // ≈ 248 m, RK4 reference above
    expect(wrapper.find('[data-test="jump-place"]').text()).toBe('Upstream of the control');
    expect(wrapper.find('[data-test="jump-sentence"]').text()).toContain('upstream of the gate');
    const toe = chartOption(wrapper).series.find((s) => s.name === 'Jump toe')!;
    expectRel(toe.data[0]![0], -ref.x, 5e-4); // upstream: negative x on the chart
    wrapper.unmount();
  });

  it('the same gate case typed in US customary shows the same distance in ft', async () => {
    const ref = gateMildReference();
    const { wrapper } = await mountPage();
    await pickKind(wrapper, 'gateMildSlope');
    await pickUnits(wrapper, 'US');
    expect(wrapper.find('label[for="jump-Q"]').text()).toBe('Discharge Q (cfs)');
    expect(wrapper.find('label[for="jump-section-width"]').text()).toBe('Channel width (ft)');
    await type(wrapper, {
      'section.width': (3 / FT).toFixed(9),
      Q: (6 / FT ** 3).toFixed(7),
      opening: (0.3 / FT).toFixed(9),
      Cc: 0.61,
      slope: 0.0005,
      manningN: 0.014, // Manning's n is the same number in both systems (k = 1.486 carries the units)
    });
    const d = shown(wrapper, 'jump-distance');
    expect(d.unit).toBe('ft');
    expectRel(d.value, ref.x / FT, shownTol(ref.x / FT)); // ≈ 96.6 ft
    expect(wrapper.find('[data-test="jump-sentence"]').text()).toContain(
      ' ft downstream of the vena contracta',
    );
    const option = chartOption(wrapper);
    expect(option.yAxis.name).toBe('Depth y (ft)');
    expectRel(option.series.find((s) => s.name === 'Jump toe')!.data[0]![0], ref.x / FT, 5e-4);
    wrapper.unmount();
  });

  it('switching the units converts what is typed and keeps the result', async () => {
    const ref = gateMildReference();
    const { wrapper } = await mountPage();
    await pickKind(wrapper, 'gateMildSlope');
    await type(wrapper, { ...rect3Slopes, opening: 0.3, Cc: 0.61, slope: 0.0005, manningN: 0.014 });
    await pickUnits(wrapper, 'US');
    await settle(wrapper);
    // 3 m = 9.8425 ft, shown to four figures as a person would type it
    expect(wrapper.find<HTMLInputElement>(idOf('section.width')).element.value).toBe('9.843');
    const d = shown(wrapper, 'jump-distance');
    expect(d.unit).toBe('ft');
    // the inputs moved in their fourth figure (≤ 5e-4), so the distance may move a little more
    // than that; 5e-3 of it bounds the case here [tolerance: engineering judgement]
    expectRel(d.value, ref.x / FT, shownTol(ref.x / FT) + 5e-3);
    wrapper.unmount();
  });

  it('a gate opened so far that the tailwater drowns the jump says so, at distance 0', async () => {
    const { wrapper } = await mountPage();
    await pickKind(wrapper, 'gateMildSlope');
    await type(wrapper, { ...rect3Slopes, opening: 0.6, Cc: 0.61, slope: 0.0005, manningN: 0.014 });
    // the vena contracta 0.61 × 0.6 = 0.366 m already has less momentum than the normal-depth
    // tailwater: no room for the fast flow to rise to a toe (momentum, Chow 1959, §3-6)
    const c = chan(0.0005);
    expect(mom(c, 0.366)).toBeLessThan(mom(c, normal(c)));
    expect(wrapper.find('[data-test="jump-place"]').text()).toBe('Drowned at the structure');
    expect(wrapper.find('[data-test="jump-sentence"]').text()).toBe(
      'The jump is drowned: the tailwater holds it against the gate.',
    );
    expect(shown(wrapper, 'jump-distance').value).toBe(0);
    expectRel(shown(wrapper, 'jump-toe-depth').value, 0.366, 0.0005 / 0.366); // Cc·a
    expect(wrapper.find('[data-test="jump-notes"]').text()).toContain('submerged');
    wrapper.unmount();
  });

  it('a "mild" slope that is steep for the discharge gives a clear message, not a crash', async () => {
    const { wrapper } = await mountPage();
    await pickKind(wrapper, 'gateMildSlope');
    await type(wrapper, { ...rect3Slopes, opening: 0.3, Cc: 0.61, slope: 0.0005, manningN: 0.014 });
    // S0 = 0.02 is steep here: normal depth 0.417 m lies below critical 0.742 m (the reference's
    // own Manning and critical-depth relations above give these figures)
    expect(normal(chan(0.02))).toBeLessThan(critical(chan(0.02)));
    await type(wrapper, { slope: 0.02 });
    const error = wrapper.find('[data-test="jump-error"]');
    expect(error.exists()).toBe(true);
    expect(error.text()).toContain('The jump position cannot be worked out with these inputs.');
    // coded 'not-mild' with the normal and critical depths it quotes (to the hundredth)
    expect(error.text()).toContain(
      'The bed slope is not mild at this discharge: the depth downstream (0.42 m) is not above critical depth (0.74 m).',
    );
    expect(error.text()).toContain('Check the bed slope, or give the tailwater depth.');
    expect(error.text()).not.toMatch(/yDownstream|\d\.\d{6,}/); // the form's words, readable numbers
    // the last good answer stays, marked as such
    expect(wrapper.find('[data-test="jump-stale"]').exists()).toBe(true);
    expect(wrapper.find('h1').text()).toContain('Where the jump forms');
    wrapper.unmount();
  });

  it('a slope break whose steep reach is not steep says which slope is wrong', async () => {
    const { wrapper } = await mountPage();
    await type(wrapper, { ...rect3Slopes, 'upstream.slope': 0.001 });
    const error = wrapper.find('[data-test="jump-error"]');
    expect(error.text()).toContain('The upstream slope is not steep at this discharge');
    wrapper.unmount();
  });

  it('a negative discharge is refused under its field and pauses the result', async () => {
    const { wrapper } = await mountPage();
    await type(wrapper, { Q: -6 });
    const item = wrapper.find(idOf('Q')).element.closest('.ant-form-item')!;
    await vi.waitFor(() =>
      expect(item.querySelector('.ant-form-item-explain-error')?.textContent).toBe(
        'The discharge Q must be greater than zero.',
      ),
    );
    expect(wrapper.find('[data-test="jump-input-problems"]').text()).toContain(
      'The discharge Q must be greater than zero.',
    );
    expect(wrapper.find('[data-test="jump-error"]').exists()).toBe(false);
    // the value stays as typed (never pulled back to a bound), and the result says it waits
    expect(Number(wrapper.find<HTMLInputElement>(idOf('Q')).element.value)).toBe(-6);
    expect(wrapper.find('[data-test="jump-input-problems"]').text()).toMatch(
      /Results are paused: waiting for a valid value/,
    );
    // typing a good value again brings the result back
    await type(wrapper, { Q: 12 });
    expect(wrapper.find('[data-test="jump-input-problems"]').exists()).toBe(false);
    expect(wrapper.find('[data-test="jump-stale"]').exists()).toBe(false);
    wrapper.unmount();
  });

  it('switching situation keeps the page working and keeps what was typed for each', async () => {
    const { wrapper } = await mountPage();
    await type(wrapper, { 'upstream.slope': 0.06 });
    const seen: string[] = [];
    for (const kind of ['gateMildSlope', 'gateSteepSlope', 'weirToMildSlope', 'slopeBreak']) {
      await pickKind(wrapper, kind);
      await settle(wrapper);
      expect(wrapper.find('[data-test="jump-error"]').exists(), kind).toBe(false);
      expect(wrapper.find('[data-test="jump-input-problems"]').exists(), kind).toBe(false);
      expect(wrapper.find('[data-test="jump-stale"]').exists(), kind).toBe(false);
      seen.push(wrapper.find('[data-test="jump-sentence"]').text());
    }
    expect(seen[0]).toContain('vena contracta');
    expect(seen[1]).toContain('upstream of the gate');
    expect(seen[2]).toContain('foot of the weir');
    expect(seen[3]).toContain('slope break');
    // back on the slope break, the slope typed before is still there
    expect(Number(wrapper.find<HTMLInputElement>(idOf('upstream.slope')).element.value)).toBe(0.06);
    // a gate on a steep slope can take the pool depth typed in instead of the gate opening
    await pickKind(wrapper, 'gateSteepSlope');
    await wrapper.find('[data-test="jump-pool-depth"] input').setValue(true);
    await settle(wrapper);
    expect(wrapper.find(idOf('opening')).exists()).toBe(false);
    expect(wrapper.find(idOf('upstreamDepth')).exists()).toBe(true);
    expect(wrapper.find('[data-test="jump-error"]').exists()).toBe(false);
    expect(wrapper.find('[data-test="jump-sentence"]').text()).toContain('upstream of the gate');
    wrapper.unmount();
  });
});

describe('the side navigation', () => {
  it.each([
    ['engineer', ['Projects', 'Where the jump forms', 'Price books', 'Account']],
    [
      'owner',
      [
        'Projects',
        'Where the jump forms',
        'Price books',
        'Team',
        'Firm brand',
        'Billing',
        'Account',
      ],
    ],
    ['viewer', ['Projects', 'Where the jump forms', 'Price books', 'Account']],
  ] as const)(
    'lists the jump position tool for a %s, right after Projects',
    async (role, labels) => {
      localStorage.setItem(TOKEN_KEY, `tok-${role}`);
      setActivePinia(createPinia());
      stubApi({ 'GET /auth/me': { status: 200, body: { user: demoUser(role), firm: demoFirm } } });
      const router = createAppRouter(createMemoryHistory());
      await router.push('/tools/jump-position');
      const wrapper = mount(AppShell, {
        global: { plugins: [router] },
        slots: { default: '<p>page</p>' },
      });
      await flushPromises();
      const items = wrapper.findAll('nav a').map((a) => a.text().trim());
      expect(items).toEqual(labels);
      expect(wrapper.find('nav a[aria-current="page"]').text()).toContain('Where the jump forms');
      wrapper.unmount();
    },
  );
});
