import { describe, expect, it } from 'vitest';
import openapi from '../../api/src/openapi.json' with { type: 'json' };
import { bearer, setPlan, signUpFirm, apiForFile } from '../support/api-app';

// Every operation of the OpenAPI document, fed bodies, ids and query strings that are wrong in
// every way we could think of: the answer is always a 4xx (or a success for input that is merely
// odd) in the one error shape — never a 500 — and a bad write leaves the database as it was.

let token = '';
let firmId = '';
let projectId = '';
let memberId = '';

const h = apiForFile(async () => {
  const firm = await signUpFirm(h, 'malformed');
  token = firm.token;
  firmId = firm.firm.id;
  memberId = firm.user.id;
  await setPlan(h, firmId, 'firm', 5);
  const p = await h
    .http()
    .post('/api/v1/projects')
    .set(bearer(token))
    .send({ name: 'Target', units: 'SI' });
  projectId = p.body.id;
});

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
const operations: { method: Method; path: string }[] = [];
for (const [path, item] of Object.entries(
  openapi.paths as Record<string, Record<string, unknown>>,
)) {
  for (const method of Object.keys(item)) {
    if (['get', 'post', 'put', 'patch', 'delete'].includes(method))
      operations.push({ method: method as Method, path });
  }
}

const deep = (n: number): unknown => (n === 0 ? 1 : { a: deep(n - 1) });
const BODIES: [string, string][] = [
  ['a JSON array', '[1,2,3]'],
  ['a JSON string', '"hello"'],
  ['JSON null', 'null'],
  ['a number', '42'],
  ['truncated JSON', '{"name": "x", '],
  [
    'wrong types everywhere',
    JSON.stringify({
      name: 12,
      email: ['a'],
      password: { x: 1 },
      units: 'metric',
      role: 'king',
      status: 7,
      input: 'nope',
      section: 'round',
      Q: 'lots',
      y1: null,
      token: 5,
      firmName: true,
      active: 'yes',
    }),
  ],
  [
    'non-finite-looking numbers',
    '{"Q": 1e999, "y1": -0, "basinWidth": 1e308, "designDischarge": -1e-320}',
  ],
  ['a prototype key', '{"__proto__": {"admin": true}, "constructor": {"prototype": {"x": 1}}}'],
  ['deep nesting', JSON.stringify(deep(200))],
  [
    'a long string',
    JSON.stringify({ name: 'x'.repeat(20000), email: `${'a'.repeat(5000)}@b.example` }),
  ],
];
const IDS = [
  'not-a-uuid',
  '00000000-0000-0000-0000-000000000000',
  "1' OR '1'='1",
  '%00',
  'x'.repeat(300),
];

function concrete(path: string, id: string): string {
  return path.replace('{id}', encodeURIComponent(id)).replace('{token}', encodeURIComponent(id));
}

async function counts() {
  return {
    projects: await h.models.Project.count({ where: { firmId } }),
    users: await h.models.User.count({ where: { firmId } }),
    invitations: await h.models.Invitation.count({ where: { firmId } }),
    designs: await h.models.Design.count({ where: { firmId } }),
  };
}

function expectClientError(res: { status: number; body: unknown }, what: string) {
  expect(
    res.status,
    `${what} → ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`,
  ).toBeLessThan(500);
  if (res.status >= 400) {
    const body = res.body as { code?: unknown; message?: unknown };
    expect(typeof body.code, what).toBe('string');
    expect(typeof body.message, what).toBe('string');
  }
}

describe('no operation answers 500 to malformed input', () => {
  it('the document lists the operations we probe', () => {
    expect(operations.length).toBeGreaterThan(15);
  });

  // Sign-out is probed last (below): it would end the session the other probes use.
  it.each(operations.filter((o) => o.path !== '/auth/logout'))(
    '$method $path: bad bodies',
    async ({ method, path }) => {
      const before = await counts();
      const url = `/api/v1${concrete(path, path.includes('{') ? projectId : '')}`;
      for (const [label, raw] of BODIES) {
        if (method === 'get' || method === 'delete') continue;
        const agent = h.http();
        const res = await agent[method](url)
          .set(bearer(token))
          .set('Content-Type', 'application/json')
          .send(raw);
        expectClientError(res, `${method} ${path} with ${label}`);
      }
      // the only success a junk body may have is none: nothing was written
      if (!path.startsWith('/auth') && !path.startsWith('/invitations'))
        expect(await counts()).toEqual(before);
    },
  );

  it.each(operations.filter((o) => o.path.includes('{')))(
    '$method $path: bad ids',
    async ({ method, path }) => {
      const before = await counts();
      for (const id of IDS) {
        const agent = h.http();
        const res = await agent[method](`/api/v1${concrete(path, id)}`)
          .set(bearer(token))
          .send({});
        expectClientError(res, `${method} ${path} with id ${id.slice(0, 20)}`);
      }
      expect(await counts()).toEqual(before);
    },
  );

  it('odd query strings on the project list are 4xx or a normal page', async () => {
    for (const q of [
      'page=-1',
      'page=abc',
      'pageSize=100000',
      'sort=password_hash',
      'order=sideways',
      'search[$ne]=1',
      'search=%25%5F%5C',
      'page=1e3',
      'pageSize=0',
      'sort[]=name',
    ]) {
      const res = await h.http().get(`/api/v1/projects?${q}`).set(bearer(token));
      expectClientError(res, `GET /projects?${q}`);
    }
  });

  it('a wrong content type or a non-JSON body is a 4xx', async () => {
    const form = await h
      .http()
      .post('/api/v1/projects')
      .set(bearer(token))
      .set('Content-Type', 'application/x-www-form-urlencoded')
      .send('name=x&units=SI');
    expectClientError(form, 'form-encoded project');
    const text = await h
      .http()
      .put(`/api/v1/projects/${projectId}/design`)
      .set(bearer(token))
      .set('Content-Type', 'text/plain')
      .send('{"input": 1}');
    expectClientError(text, 'text/plain design');
    expect(await h.models.Design.count({ where: { firmId } })).toBe(0);
  });

  it('sign-out ignores any body and ends the session', async () => {
    const other = await signUpFirm(h, 'malformed-logout');
    for (const [label, raw] of BODIES) {
      const res = await h
        .http()
        .post('/api/v1/auth/logout')
        .set(bearer(other.token))
        .set('Content-Type', 'application/json')
        .send(raw);
      expectClientError(res, `logout with ${label}`);
    }
    expect((await h.http().get('/api/v1/auth/me').set(bearer(other.token))).status).toBe(401);
  });

  it('a member id that is not a uuid is a 404 for PATCH /members/:id, and the member is unchanged', async () => {
    const res = await h
      .http()
      .patch('/api/v1/members/abc')
      .set(bearer(token))
      .send({ role: 'viewer' });
    expect(res.status).toBe(404);
    expect((await h.models.User.findByPk(memberId))?.role).toBe('owner');
  });
});
