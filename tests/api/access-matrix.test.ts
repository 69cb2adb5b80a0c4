import { describe, expect, it } from 'vitest';
import { ACTIONS, POLICY, ROLES, TOKEN_TTL_MS, type Action, type Role } from '@basinwright/common';
import openapi from '../../api/src/openapi.json' with { type: 'json' };
import { fenwickDesign } from '../../seed/designs';
import {
  addMember,
  bearer,
  setPlan,
  signUpFirm,
  apiForFile,
  uniqueEmail,
  TEST_PASSWORD,
} from '../support/api-app';

let firmId = '';
let ownerId = '';
let ownerToken = '';

const h = apiForFile(async () => {
  const firm = await signUpFirm(h, 'matrix');
  firmId = firm.firm.id;
  ownerId = firm.user.id;
  ownerToken = firm.token;
  await setPlan(h, firmId, 'firm', 1000);
});

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

interface RouteCase {
  action: Action;
  method: Method;
  /** OpenAPI path template under /api/v1. */
  path: string;
  /** Prepares what the request needs; returns the concrete path, body and a check of the side effect. */
  prepare(): Promise<{
    url: string;
    body?: object;
    /** A multipart upload instead of a JSON body: text fields and one file. */
    upload?: { fields: Record<string, string>; file: Buffer; name: string };
    changed?: () => Promise<boolean>;
  }>;
  success: number;
}

/** Sends the case's body: JSON, or multipart when it uploads a file. */
function sendBody(
  req: ReturnType<ReturnType<typeof h.http>['get']>,
  prepared: Awaited<ReturnType<RouteCase['prepare']>>,
) {
  if (prepared.upload === undefined) return req.send(prepared.body ?? {});
  for (const [key, value] of Object.entries(prepared.upload.fields)) req = req.field(key, value);
  return req.attach('file', prepared.upload.file, prepared.upload.name);
}

async function newPriceBook(name = 'Matrix book') {
  const book = await h.models.PriceBook.create({ firmId, name, createdById: ownerId });
  await h.models.PriceBookItem.create({
    firmId,
    priceBookId: book.id,
    code: 'C-1',
    description: 'Concrete',
    unit: 'm3',
    unitPrice: 100,
    currency: 'USD',
  });
  return book;
}

let designedProject: Promise<string> | undefined;

/** One project with a saved (computed) design, made once, for the take-off and estimate routes. */
function projectWithDesign(): Promise<string> {
  designedProject ??= (async () => {
    const project = await newProject('Matrix designed project');
    const res = await h
      .http()
      .put(`/api/v1/projects/${project.id}/design`)
      .set(bearer(ownerToken))
      .send({ input: fenwickDesign });
    expect(res.status).toBe(200);
    return project.id;
  })();
  return designedProject;
}

/** A draft revision on the designed project, priced by a book that maps one concrete line. */
async function newEstimate() {
  const projectId = await projectWithDesign();
  const book = await newPriceBook();
  await book.update({ takeoffMapping: { 'concrete.floorSlab': 'C-1' } });
  const revision =
    (await h.models.Estimate.max<number, InstanceType<typeof h.models.Estimate>>('revision', {
      where: { projectId },
    })) ?? 0;
  return h.models.Estimate.create({
    firmId,
    projectId,
    revision: revision + 1,
    priceBookId: book.id,
    settings: {
      locationFactor: 1,
      percentages: { mobilisation: 0, careOfWater: 0, contingency: 0, overheadAndProfit: 0 },
      escalation: { annualRate: 0, years: 0 },
      accuracy: { aaceClass: 5 },
    },
    createdById: ownerId,
  });
}

const PRICE_CSV = Buffer.from('Code,Description,Unit,Unit price\nX-9,Matrix item,m3,12.5\n');
const PRICE_MAPPING = JSON.stringify({
  code: 'Code',
  description: 'Description',
  unit: 'Unit',
  unitPrice: 'Unit price',
});

async function newProject(name = 'Matrix project') {
  return h.models.Project.create({ firmId, name, units: 'SI', createdById: ownerId });
}

/** Every authenticated route, with the policy action that guards it. */
const routes: RouteCase[] = [
  {
    action: 'session.read',
    method: 'get',
    path: '/auth/me',
    success: 200,
    prepare: async () => ({ url: '/auth/me' }),
  },
  {
    action: 'session.end',
    method: 'post',
    path: '/auth/logout',
    success: 204,
    prepare: async () => ({ url: '/auth/logout' }),
  },
  {
    action: 'profile.update',
    method: 'patch',
    path: '/auth/me',
    success: 200,
    prepare: async () => ({ url: '/auth/me', body: { name: 'Renamed in the matrix' } }),
  },
  {
    action: 'password.change',
    method: 'post',
    path: '/auth/change-password',
    success: 200,
    prepare: async () => ({
      url: '/auth/change-password',
      body: { currentPassword: TEST_PASSWORD, newPassword: 'a brand new password' },
    }),
  },
  {
    action: 'members.list',
    method: 'get',
    path: '/members',
    success: 200,
    prepare: async () => ({ url: '/members' }),
  },
  {
    action: 'members.update',
    method: 'patch',
    path: '/members/{id}',
    success: 200,
    prepare: async () => {
      const target = await addMember(h, firmId, 'viewer');
      return {
        url: `/members/${target.id}`,
        body: { role: 'estimator' },
        changed: async () => (await h.models.User.findByPk(target.id))?.role === 'estimator',
      };
    },
  },
  {
    action: 'invitations.list',
    method: 'get',
    path: '/members/invitations',
    success: 200,
    prepare: async () => ({ url: '/members/invitations' }),
  },
  {
    action: 'invitations.create',
    method: 'post',
    path: '/members/invitations',
    success: 201,
    prepare: async () => {
      const email = uniqueEmail('matrix-invitee');
      return {
        url: '/members/invitations',
        body: { email, role: 'viewer' },
        changed: async () => (await h.models.Invitation.count({ where: { email } })) > 0,
      };
    },
  },
  {
    action: 'invitations.revoke',
    method: 'delete',
    path: '/members/invitations/{id}',
    success: 204,
    prepare: async () => {
      const invitation = await h.models.Invitation.create({
        firmId,
        email: uniqueEmail('matrix-revoke'),
        role: 'viewer',
        tokenHash: uniqueEmail('hash').padEnd(64, 'x').slice(0, 64),
        expiresAt: new Date(Date.now() + TOKEN_TTL_MS.invitation),
        invitedById: ownerId,
      });
      return {
        url: `/members/invitations/${invitation.id}`,
        changed: async () => (await h.models.Invitation.findByPk(invitation.id)) === null,
      };
    },
  },
  {
    action: 'projects.list',
    method: 'get',
    path: '/projects',
    success: 200,
    prepare: async () => ({ url: '/projects' }),
  },
  {
    action: 'projects.create',
    method: 'post',
    path: '/projects',
    success: 201,
    prepare: async () => {
      const name = `Created ${uniqueEmail('p')}`;
      return {
        url: '/projects',
        body: { name, units: 'US' },
        changed: async () => (await h.models.Project.count({ where: { firmId, name } })) > 0,
      };
    },
  },
  {
    action: 'projects.read',
    method: 'get',
    path: '/projects/{id}',
    success: 200,
    prepare: async () => ({ url: `/projects/${(await newProject()).id}` }),
  },
  {
    action: 'projects.update',
    method: 'patch',
    path: '/projects/{id}',
    success: 200,
    prepare: async () => {
      const project = await newProject();
      return {
        url: `/projects/${project.id}`,
        body: { status: 'issued' },
        changed: async () => (await h.models.Project.findByPk(project.id))?.status === 'issued',
      };
    },
  },
  {
    action: 'projects.delete',
    method: 'delete',
    path: '/projects/{id}',
    success: 204,
    prepare: async () => {
      const project = await newProject();
      return {
        url: `/projects/${project.id}`,
        changed: async () => (await h.models.Project.findByPk(project.id)) === null,
      };
    },
  },
  {
    action: 'designs.read',
    method: 'get',
    path: '/projects/{id}/design',
    success: 200,
    prepare: async () => ({ url: `/projects/${(await newProject()).id}/design` }),
  },
  {
    action: 'designs.write',
    method: 'put',
    path: '/projects/{id}/design',
    success: 200,
    prepare: async () => {
      const project = await newProject();
      return {
        url: `/projects/${project.id}/design`,
        body: { input: fenwickDesign },
        changed: async () =>
          (await h.models.Design.count({ where: { projectId: project.id } })) === 1,
      };
    },
  },
  {
    action: 'priceBooks.list',
    method: 'get',
    path: '/price-books',
    success: 200,
    prepare: async () => ({ url: '/price-books' }),
  },
  {
    action: 'priceBooks.create',
    method: 'post',
    path: '/price-books',
    success: 201,
    prepare: async () => {
      const name = `Book ${uniqueEmail('b')}`;
      return {
        url: '/price-books',
        body: { name },
        changed: async () => (await h.models.PriceBook.count({ where: { firmId, name } })) > 0,
      };
    },
  },
  {
    action: 'priceBooks.read',
    method: 'get',
    path: '/price-books/{id}',
    success: 200,
    prepare: async () => ({ url: `/price-books/${(await newPriceBook()).id}` }),
  },
  {
    action: 'priceBooks.update',
    method: 'patch',
    path: '/price-books/{id}',
    success: 200,
    prepare: async () => {
      const book = await newPriceBook();
      return {
        url: `/price-books/${book.id}`,
        body: { archived: true },
        changed: async () => (await h.models.PriceBook.findByPk(book.id))?.archivedAt !== null,
      };
    },
  },
  {
    action: 'priceBooks.items',
    method: 'put',
    path: '/price-books/{id}/items',
    success: 200,
    prepare: async () => {
      const book = await newPriceBook();
      return {
        url: `/price-books/${book.id}/items`,
        body: { items: [{ code: 'N-1', description: 'New', unit: 'kg', unitPrice: 2 }] },
        changed: async () =>
          (await h.models.PriceBookItem.count({ where: { priceBookId: book.id, code: 'N-1' } })) ===
          1,
      };
    },
  },
  {
    action: 'priceBooks.copy',
    method: 'post',
    path: '/price-books/{id}/copy',
    success: 201,
    prepare: async () => {
      const book = await newPriceBook(`Copied ${uniqueEmail('c')}`);
      return {
        url: `/price-books/${book.id}/copy`,
        changed: async () =>
          (await h.models.PriceBook.count({ where: { firmId, name: `Copy of ${book.name}` } })) > 0,
      };
    },
  },
  {
    action: 'priceBooks.preview',
    method: 'post',
    path: '/price-books/import/preview',
    success: 200,
    prepare: async () => ({
      url: '/price-books/import/preview',
      upload: { fields: {}, file: PRICE_CSV, name: 'prices.csv' },
    }),
  },
  {
    action: 'priceBooks.import',
    method: 'post',
    path: '/price-books/{id}/import',
    success: 200,
    prepare: async () => {
      const book = await newPriceBook();
      return {
        url: `/price-books/${book.id}/import`,
        upload: { fields: { mapping: PRICE_MAPPING }, file: PRICE_CSV, name: 'prices.csv' },
        changed: async () =>
          (await h.models.PriceBookItem.count({ where: { priceBookId: book.id, code: 'X-9' } })) ===
          1,
      };
    },
  },
  {
    action: 'priceBooks.export',
    method: 'get',
    path: '/price-books/{id}/export',
    success: 200,
    prepare: async () => ({ url: `/price-books/${(await newPriceBook()).id}/export?format=xlsx` }),
  },
  {
    action: 'takeoff.read',
    method: 'get',
    path: '/projects/{id}/takeoff',
    success: 200,
    prepare: async () => ({ url: `/projects/${await projectWithDesign()}/takeoff` }),
  },
  {
    action: 'takeoff.write',
    method: 'put',
    path: '/projects/{id}/takeoff/overrides',
    success: 200,
    prepare: async () => {
      const projectId = await projectWithDesign();
      const design = await h.models.Design.findOne({ where: { projectId } });
      await h.models.DesignTakeoff.destroy({ where: { designId: design!.id } });
      return {
        url: `/projects/${projectId}/takeoff/overrides`,
        body: { overrides: { workingRoom: 0.9 } },
        changed: async () =>
          (await h.models.DesignTakeoff.count({ where: { designId: design!.id } })) === 1,
      };
    },
  },
  {
    action: 'estimates.list',
    method: 'get',
    path: '/projects/{id}/estimates',
    success: 200,
    prepare: async () => ({ url: `/projects/${await projectWithDesign()}/estimates` }),
  },
  {
    action: 'estimates.create',
    method: 'post',
    path: '/projects/{id}/estimates',
    success: 201,
    prepare: async () => {
      const project = await newProject('Matrix estimate project');
      return {
        url: `/projects/${project.id}/estimates`,
        body: {},
        changed: async () =>
          (await h.models.Estimate.count({ where: { projectId: project.id } })) === 1,
      };
    },
  },
  {
    action: 'estimates.read',
    method: 'get',
    path: '/estimates/{id}',
    success: 200,
    prepare: async () => ({ url: `/estimates/${(await newEstimate()).id}` }),
  },
  {
    action: 'estimates.update',
    method: 'patch',
    path: '/estimates/{id}',
    success: 200,
    prepare: async () => {
      const estimate = await newEstimate();
      return {
        url: `/estimates/${estimate.id}`,
        body: { priceBookId: null },
        changed: async () => (await h.models.Estimate.findByPk(estimate.id))?.priceBookId === null,
      };
    },
  },
  {
    action: 'estimates.override',
    method: 'post',
    path: '/estimates/{id}/overrides',
    success: 200,
    prepare: async () => {
      const estimate = await newEstimate();
      return {
        url: `/estimates/${estimate.id}/overrides`,
        body: { key: 'concrete.floorSlab', quantity: 12, reason: 'Matrix check' },
        changed: async () =>
          (await h.models.EstimateAuditEntry.count({ where: { estimateId: estimate.id } })) === 1,
      };
    },
  },
  {
    action: 'estimates.issue',
    method: 'post',
    path: '/estimates/{id}/issue',
    success: 200,
    prepare: async () => {
      const estimate = await newEstimate();
      return {
        url: `/estimates/${estimate.id}/issue`,
        changed: async () => (await h.models.Estimate.findByPk(estimate.id))?.status === 'issued',
      };
    },
  },
  {
    action: 'estimates.export',
    method: 'get',
    path: '/estimates/{id}/export',
    success: 200,
    prepare: async () => ({ url: `/estimates/${(await newEstimate()).id}/export?format=xlsx` }),
  },
];

describe('the route table covers every guarded route', () => {
  it('has one case per policy action', () => {
    expect(routes.map((r) => r.action).sort()).toEqual([...ACTIONS].sort());
  });

  it('has one case per bearer-secured operation in openapi.json (engine routes aside)', () => {
    const secured: string[] = [];
    for (const [path, item] of Object.entries(
      openapi.paths as Record<string, Record<string, { security?: unknown[] }>>,
    )) {
      if (path.startsWith('/calc')) continue;
      for (const [method, op] of Object.entries(item))
        if (op.security !== undefined) secured.push(`${method} ${path}`);
    }
    expect(routes.map((r) => `${r.method} ${r.path}`).sort()).toEqual(secured.sort());
  });
});

describe.each(routes)('$method $path ($action)', (route) => {
  it('without a token: 401', async () => {
    const prepared = await route.prepare();
    const agent = h.http();
    const res = await sendBody(agent[route.method](`/api/v1${prepared.url}`), prepared);
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('unauthorized');
  });

  it.each(ROLES)('as %s: allowed only if the policy says so', async (role: Role) => {
    const member = await addMember(h, firmId, role);
    const prepared = await route.prepare();
    const { changed } = prepared;
    const agent = h.http();
    const res = await sendBody(
      agent[route.method](`/api/v1${prepared.url}`).set(bearer(member.token)),
      prepared,
    );
    const allowed = (POLICY[route.action] as readonly Role[]).includes(role);
    if (allowed) {
      expect(res.status, JSON.stringify(res.body)).toBe(route.success);
      if (changed !== undefined) expect(await changed()).toBe(true);
    } else {
      expect(res.status).toBe(403);
      expect(res.body).toEqual({ code: 'forbidden', message: 'Your role does not allow this.' });
      if (changed !== undefined) expect(await changed()).toBe(false);
    }
  });
});
