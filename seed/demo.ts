import type { Plan, ProjectStatus, ProjectUnits, Role } from '@basinwright/common';

// Demo data: the invented scenario of the product brief. No real firm, place or person.

export const DEMO_PASSWORD = 'basinwright-demo';

export interface DemoFirm {
  name: string;
  plan: Plan;
  seats: number;
  brandColor: string | null;
}

// The demo firm starts on the free Concept plan (one seat) so its owner can show the upgrade
// through the fake checkout. Its five members were there before: members over the seat count
// keep their access; new invitations are refused until the firm buys seats.
export const demoFirm: DemoFirm = {
  name: 'Harrow & Lune Engineering',
  plan: 'concept',
  seats: 1,
  brandColor: '#0f6e6e',
};

export const demoUsers: { name: string; email: string; role: Role }[] = [
  { name: 'Morwenna Harrow', email: 'owner@harrow-lune.example', role: 'owner' },
  { name: 'Tobias Lune', email: 'admin@harrow-lune.example', role: 'admin' },
  { name: 'Priya Okonjo-Vale', email: 'engineer@harrow-lune.example', role: 'engineer' },
  { name: 'Declan Ashby', email: 'estimator@harrow-lune.example', role: 'estimator' },
  { name: 'Ingrid Sallow', email: 'viewer@harrow-lune.example', role: 'viewer' },
];

export const demoProjects: {
  name: string;
  client: string;
  location: string;
  units: ProjectUnits;
  status: ProjectStatus;
  notes: string;
  createdByEmail: string;
}[] = [
  {
    name: 'Fenwick Mill Pond — auxiliary spillway outlet',
    client: 'Fenwick Mill Pond Trust',
    location: 'Fenwick Mill Pond dam, east abutment, Harrowdale',
    units: 'SI',
    status: 'in review',
    notes:
      'Ogee crest 12 m long at 102.00 m (weir coefficient 2.15, SI; approach velocity negligible). ' +
      '12 m wide rectangular chute to the downstream channel bed at 90.00 m; chute loss 10 % of the head. ' +
      'Design discharge 85 m³/s; check 5–85 m³/s. Tailwater from normal depth in the trapezoidal ' +
      'downstream channel: bottom 14 m, side slopes 2H:1V, slope 0.0015, n = 0.030.',
    createdByEmail: 'engineer@harrow-lune.example',
  },
  {
    name: 'Caldwell Run culvert outlet',
    client: 'Lunefield Borough Highways',
    location: 'Caldwell Run crossing under Old Quarry Lane, Lunefield',
    units: 'US',
    status: 'draft',
    notes:
      'Single 6 ft × 6 ft concrete box culvert; design discharge 420 cfs. Outlet basin to protect the run below the lane.',
    createdByEmail: 'engineer@harrow-lune.example',
  },
];

// A second invented firm on the Concept plan that has reached its project limit (3 projects):
// "New project" shows the upgrade prompt.
export const conceptFirm: DemoFirm = {
  name: 'Kestrel Bank Hydraulics',
  plan: 'concept',
  seats: 1,
  brandColor: null,
};

export const conceptUsers: typeof demoUsers = [
  { name: 'Orla Kestrel', email: 'owner@kestrel-bank.example', role: 'owner' },
];

export const conceptProjects: typeof demoProjects = [
  {
    name: 'Brackenhope weir apron',
    client: 'Brackenhope Angling Association',
    location: 'Brackenhope Beck, below the old mill weir',
    units: 'SI',
    status: 'draft',
    notes: 'Apron repair study below a low masonry weir.',
    createdByEmail: 'owner@kestrel-bank.example',
  },
  {
    name: 'Sallowmere overflow channel',
    client: 'Sallowmere Estate',
    location: 'Sallowmere lake, north overflow',
    units: 'SI',
    status: 'draft',
    notes: 'Overflow channel from the lake to the beck.',
    createdByEmail: 'owner@kestrel-bank.example',
  },
  {
    name: 'Thornby Lane culvert outlet',
    client: 'Thornby Parish',
    location: 'Thornby Lane, at the ford',
    units: 'US',
    status: 'draft',
    notes: 'Outlet protection for a lane culvert.',
    createdByEmail: 'owner@kestrel-bank.example',
  },
];

/** Every demo firm the seed loads, with its members and projects. */
export const demoFirms = [
  { firm: demoFirm, users: demoUsers, projects: demoProjects },
  { firm: conceptFirm, users: conceptUsers, projects: conceptProjects },
];
/** Members marked as licensed reviewer (invented licence and jurisdiction). */
export const demoReviewers: {
  email: string;
  licenceNumber: string;
  jurisdiction: string;
  statement: string;
}[] = [
  {
    email: 'owner@harrow-lune.example',
    licenceNumber: 'PE-HL-20417',
    jurisdiction: 'Harrowdale Board of Professional Engineers',
    statement:
      'I have reviewed this concept design and find it suitable for the purpose stated. ' +
      'Final design remains subject to site investigation and the approving authority.',
  },
];
/**
 * The demo firm's one price book. Every rate is INVENTED for the demo (illustrative only, not
 * a market price); the book's name and notes say so. `takeoffMapping` is the remembered
 * mapping of take-off lines (kind.element) to its codes, by kind of work; riprap is priced by
 * volume, so its mass line stays unmapped (it would count the stone twice).
 */
export const demoPriceBook: {
  name: string;
  currency: string;
  notes: string;
  items: {
    code: string;
    description: string;
    unit: string;
    unitPrice: number;
    source: string;
    dateNote: string;
  }[];
  codeByKind: Record<string, string>;
} = {
  name: 'Invented demo rates (illustrative, not real prices)',
  currency: 'USD',
  notes:
    'Invented for the Basinwright demo. These unit rates are illustrative only: they come from ' +
    'no supplier, survey or published index. Replace them with your firm’s own rates.',
  items: [
    {
      code: 'CONC',
      description: 'Structural concrete, placed and finished',
      unit: 'm3',
      unitPrice: 520,
      source: 'Invented (demo)',
      dateNote: 'Demo 2026',
    },
    {
      code: 'REBAR',
      description: 'Reinforcement, cut, bent and fixed',
      unit: 'kg',
      unitPrice: 2.6,
      source: 'Invented (demo)',
      dateNote: 'Demo 2026',
    },
    {
      code: 'FORM',
      description: 'Formwork to concrete faces',
      unit: 'm2',
      unitPrice: 65,
      source: 'Invented (demo)',
      dateNote: 'Demo 2026',
    },
    {
      code: 'EXC',
      description: 'Structural excavation, any material',
      unit: 'm3',
      unitPrice: 18,
      source: 'Invented (demo)',
      dateNote: 'Demo 2026',
    },
    {
      code: 'FILL',
      description: 'Backfill, compacted in layers',
      unit: 'm3',
      unitPrice: 14,
      source: 'Invented (demo)',
      dateNote: 'Demo 2026',
    },
    {
      code: 'RIP',
      description: 'Riprap, placed',
      unit: 'm3',
      unitPrice: 95,
      source: 'Invented (demo)',
      dateNote: 'Demo 2026',
    },
    {
      code: 'BED',
      description: 'Granular bedding under riprap',
      unit: 'm3',
      unitPrice: 48,
      source: 'Invented (demo)',
      dateNote: 'Demo 2026',
    },
    {
      code: 'GEO',
      description: 'Geotextile separator, laid',
      unit: 'm2',
      unitPrice: 6.5,
      source: 'Invented (demo)',
      dateNote: 'Demo 2026',
    },
    {
      code: 'WSTOP',
      description: 'PVC waterstop in joints',
      unit: 'm',
      unitPrice: 42,
      source: 'Invented (demo)',
      dateNote: 'Demo 2026',
    },
    {
      code: 'JOINT',
      description: 'Contraction joint, sealed',
      unit: 'm',
      unitPrice: 30,
      source: 'Invented (demo)',
      dateNote: 'Demo 2026',
    },
  ],
  codeByKind: {
    concrete: 'CONC',
    reinforcement: 'REBAR',
    formwork: 'FORM',
    excavation: 'EXC',
    backfill: 'FILL',
    riprap: 'RIP',
    bedding: 'BED',
    geotextile: 'GEO',
    waterstop: 'WSTOP',
    joint: 'JOINT',
  },
};
