import type { Plan, ProjectStatus, ProjectUnits, Role } from '@basinwright/common';

// Demo data: the invented scenario of the product brief. No real firm, place or person.

export const DEMO_PASSWORD = 'basinwright-demo';

export const demoFirm: { name: string; plan: Plan; seats: number; brandColor: string } = {
  name: 'Harrow & Lune Engineering',
  plan: 'firm',
  seats: 5,
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
