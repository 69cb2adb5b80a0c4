import { describe, expect, it } from 'vitest';
import openapi from '../../api/src/openapi.json' with { type: 'json' };
import { MAX_JSON_DEPTH } from '../../api/src/middlewares/request-shape';
import { fenwickDesign } from '../../seed/designs';
import { bearer, setPlan, signUpFirm, apiForFile } from '../support/api-app';
import { fakePaymentsForFile } from '../support/fake-payments';

// Every operation of the OpenAPI document, fed bodies, ids and query strings that are wrong in
// every way we could think of: the answer is always a 4xx (or a success for input that is merely
// odd) in the one error shape — never a 500 — and a bad write leaves the database as it was.

let token = '';
let firmId = '';
let projectId = '';
let memberId = '';

// The billing routes call the payment service: its local stand-in runs for this file.
fakePaymentsForFile();

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

/**
 * Operations whose body is a signed event read as raw bytes (the payment service's webhook): it
 * is never parsed before its signature is checked, so junk there is a 400 `bad_request` (no
 * signature), not the JSON parser's `bad_json` or a field's 422. Checked as such below.
 */
const SIGNED_RAW = new Set(['/billing/webhook']);

async function expectUnsignedRefused(raw: string, what: string): Promise<void> {
  for (const path of SIGNED_RAW) {
    const res = await h
      .http()
      .post(`/api/v1${path}`)
      .set('Content-Type', 'application/json')
      .send(raw);
    expect(res.status, `${path} with ${what}`).toBe(400);
    expect(res.body.code).toBe('bad_request');
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

  it('a malformed percent-escape in any path is a 400, signed in or not', async () => {
    const templated = operations.filter((o) => o.path.includes('{'));
    expect(templated.length).toBeGreaterThan(4);
    for (const { method, path } of templated) {
      for (const escape of ['%ZZ', '%', 'a%2', '%C0%AF', '%E0%A4%A']) {
        const url = `/api/v1${path.replace(/\{\w+\}/, escape)}`;
        for (const signedIn of [true, false]) {
          const req = h.http()[method](url);
          const res = await (signedIn ? req.set(bearer(token)) : req).send({});
          expect(res.status, `${method} ${url} signed in: ${signedIn}`).toBe(400);
          expect(res.body.code).toBe('bad_request');
        }
      }
    }
    // outside the API too (the web app's paths)
    expect((await h.http().get('/projects/%ZZ')).status).toBe(400);
  });

  it(`JSON nested deeper than ${MAX_JSON_DEPTH} levels is a 400 on every operation with a body`, async () => {
    // 10,000 levels in about 50 KB, the probe that once ended in a 500 on sign-in.
    const deepRaw = `${'{"a":'.repeat(10_000)}1${'}'.repeat(10_000)}`;
    expect(deepRaw.length).toBeGreaterThan(50_000);
    const justOver = JSON.stringify(deep(MAX_JSON_DEPTH + 1));
    const deepArray = `${'['.repeat(MAX_JSON_DEPTH + 1)}${']'.repeat(MAX_JSON_DEPTH + 1)}`;
    const withBody = operations.filter(
      (o) =>
        o.method !== 'get' &&
        o.method !== 'delete' &&
        o.path !== '/auth/logout' &&
        !SIGNED_RAW.has(o.path),
    );
    for (const { method, path } of withBody) {
      for (const raw of [deepRaw, justOver, deepArray]) {
        const res = await h
          .http()
          [method](`/api/v1${concrete(path, projectId)}`)
          .set(bearer(token))
          .set('Content-Type', 'application/json')
          .send(raw);
        expect(res.status, `${method} ${path} (${raw.length} bytes)`).toBe(400);
        expect(res.body.code).toBe('bad_json');
      }
    }
    for (const raw of [deepRaw, justOver, deepArray])
      await expectUnsignedRefused(raw, `${raw.length} bytes of deep JSON`);
    // At the limit it is read (and then judged on its content, here a 401 for no session).
    const atLimit = await h
      .http()
      .post('/api/v1/calc/jump')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify(deep(MAX_JSON_DEPTH)));
    expect(atLimit.status).toBe(401);
  });

  describe('NUL characters and lone surrogates in any text or JSON field are a 422', () => {
    const BAD_TEXT: [string, string][] = [
      ['a NUL', 'Fen\\u0000wick'],
      ['a lone high surrogate', 'Fen\\ud800wick'],
      ['a lone low surrogate', '\\udc00Fenwick'],
      ['surrogates in the wrong order', '\\udc00\\ud800'],
    ];
    // Raw JSON with the escape kept as sent, so the server's parser makes the bad string.
    const body = (fields: Record<string, unknown>, key: string, bad: string) =>
      JSON.stringify(fields).replace(`"${key}":"@"`, `"${key}":"${bad}"`);

    it('a project name, client, location or notes is refused and nothing is stored', async () => {
      const before = await counts();
      for (const field of ['name', 'client', 'location', 'notes']) {
        for (const [label, bad] of BAD_TEXT) {
          const fields = { name: 'Plain', units: 'SI', [field]: '@' };
          const created = await h
            .http()
            .post('/api/v1/projects')
            .set(bearer(token))
            .set('Content-Type', 'application/json')
            .send(body(fields, field, bad));
          expect(created.status, `POST ${field} with ${label}`).toBe(422);
          expect(created.body.code).toBe('validation_error');
          expect(created.body.details[field]).toBe(created.body.message);
          const renamed = await h
            .http()
            .patch(`/api/v1/projects/${projectId}`)
            .set(bearer(token))
            .set('Content-Type', 'application/json')
            .send(body({ [field]: '@' }, field, bad));
          expect(renamed.status, `PATCH ${field} with ${label}`).toBe(422);
        }
      }
      expect(await counts()).toEqual(before);
      const stored = await h.models.Project.findByPk(projectId);
      expect(stored?.name).toBe('Target');
    });

    it("inside a design's options, at any depth, and in a key", async () => {
      for (const [label, bad] of BAD_TEXT) {
        const options = { catalogue: { note: '@' } };
        const raw = JSON.stringify({ input: fenwickDesign, options }).replace(
          '"note":"@"',
          `"note":"${bad}"`,
        );
        const res = await h
          .http()
          .put(`/api/v1/projects/${projectId}/design`)
          .set(bearer(token))
          .set('Content-Type', 'application/json')
          .send(raw);
        expect(res.status, `options with ${label}`).toBe(422);
        expect(Object.keys(res.body.details)).toEqual(['options.catalogue.note']);
        const inKey = await h
          .http()
          .put(`/api/v1/projects/${projectId}/design`)
          .set(bearer(token))
          .set('Content-Type', 'application/json')
          .send(raw.replace(`"note":"${bad}"`, `"${bad}":1`));
        expect(inKey.status, `a key with ${label}`).toBe(422);
      }
      expect(await h.models.Design.count({ where: { firmId } })).toBe(0);
    });

    it('on every operation with a body and in query strings', async () => {
      const withBody = operations.filter(
        (o) =>
          o.method !== 'get' &&
          o.method !== 'delete' &&
          o.path !== '/auth/logout' &&
          !SIGNED_RAW.has(o.path),
      );
      for (const { method, path } of withBody) {
        for (const [label, bad] of BAD_TEXT) {
          const res = await h
            .http()
            [method](`/api/v1${concrete(path, projectId)}`)
            .set(bearer(token))
            .set('Content-Type', 'application/json')
            .send(`{"name":"${bad}","email":"a${bad}@b.example","password":"x${bad}yyyyyyyy"}`);
          expect(res.status, `${method} ${path} with ${label}`).toBe(422);
          expect(res.body.code).toBe('validation_error');
        }
      }
      for (const [label, bad] of BAD_TEXT) await expectUnsignedRefused(`{"name":"${bad}"}`, label);
      for (const q of ['search=%00', 'search=%ED%A0%80x', 'search=a%00b&page=1']) {
        const res = await h.http().get(`/api/v1/projects?${q}`).set(bearer(token));
        expectClientError(res, `GET /projects?${q}`);
        // %ED%A0%80 is not UTF-8 (an encoded surrogate): it decodes to U+FFFD, which is fine text
        if (q.includes('%00')) expect(res.status, q).toBe(422);
      }
    });
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
