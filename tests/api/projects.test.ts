import { beforeAll, describe, expect, it } from 'vitest';
import { addMember, bearer, setPlan, signUpFirm, apiForFile } from '../support/api-app';

const h = apiForFile();

const create = (token: string, body: object) =>
  h.http().post('/api/v1/projects').set(bearer(token)).send(body);
const list = (token: string, query: Record<string, string | number>) =>
  h.http().get('/api/v1/projects').query(query).set(bearer(token));

describe('projects CRUD', () => {
  it('creates with defaults, reads, updates and deletes', async () => {
    const firm = await signUpFirm(h, 'crud');
    const made = await create(firm.token, {
      name: '  Weir outlet  ',
      units: 'US',
      firmId: 'ignored',
      id: 'ignored',
    });
    expect(made.status).toBe(201);
    expect(made.body).toMatchObject({
      name: 'Weir outlet',
      units: 'US',
      client: '',
      location: '',
      status: 'draft',
      notes: '',
      createdBy: { id: firm.user.id, name: firm.user.name },
    });
    expect(Object.keys(made.body).sort()).toEqual(
      [
        'client',
        'createdAt',
        'createdBy',
        'designStatus',
        'id',
        'latestVersion',
        'location',
        'name',
        'notes',
        'readOnly',
        'status',
        'units',
        'updatedAt',
      ].sort(),
    );
    expect(made.body.readOnly).toBeNull();
    const id = made.body.id as string;
    const read = await h.http().get(`/api/v1/projects/${id}`).set(bearer(firm.token));
    expect(read.body).toEqual(made.body);

    const updated = await h
      .http()
      .patch(`/api/v1/projects/${id}`)
      .set(bearer(firm.token))
      .send({ status: 'in review', client: 'Marsh Board' });
    expect(updated.status).toBe(200);
    expect(updated.body).toMatchObject({
      status: 'in review',
      client: 'Marsh Board',
      name: 'Weir outlet',
    });
    expect(Date.parse(updated.body.updatedAt)).toBeGreaterThanOrEqual(
      Date.parse(made.body.updatedAt),
    );

    expect((await h.http().delete(`/api/v1/projects/${id}`).set(bearer(firm.token))).status).toBe(
      204,
    );
    expect((await h.http().get(`/api/v1/projects/${id}`).set(bearer(firm.token))).status).toBe(404);
    expect((await h.http().delete(`/api/v1/projects/${id}`).set(bearer(firm.token))).status).toBe(
      404,
    );
  });

  it('answers 422 with details and saves nothing for bad input', async () => {
    const firm = await signUpFirm(h, 'bad');
    const res = await create(firm.token, {
      name: '',
      units: 'imperial',
      notes: 'x'.repeat(10_001),
    });
    expect(res.status).toBe(422);
    expect(res.body.details).toEqual({
      name: 'Enter a project name.',
      units: 'Choose SI or US customary units.',
      notes: 'Notes has at most 10000 characters.',
    });
    expect(await h.models.Project.count({ where: { firmId: firm.firm.id } })).toBe(0);
    const made = await create(firm.token, { name: 'Ok', units: 'SI' });
    const patch = await h
      .http()
      .patch(`/api/v1/projects/${made.body.id}`)
      .set(bearer(firm.token))
      .send({ status: 'finished' });
    expect(patch.status).toBe(422);
    expect(
      (await h.http().get(`/api/v1/projects/${made.body.id}`).set(bearer(firm.token))).body.status,
    ).toBe('draft');
  });

  it('a malformed id is a 404, not a database error', async () => {
    const firm = await signUpFirm(h, 'badid');
    for (const method of ['get', 'patch', 'delete'] as const) {
      const agent = h.http();
      const res = await agent[method]("/api/v1/projects/1' OR '1'='1")
        .set(bearer(firm.token))
        .send({ name: 'x' });
      expect(res.status).toBe(404);
      expect(res.body.code).toBe('not_found');
    }
  });

  it('the Concept plan holds 3 projects; a paid plan has no cap', async () => {
    const firm = await signUpFirm(h, 'cap');
    for (let i = 1; i <= 3; i += 1)
      expect((await create(firm.token, { name: `P${i}`, units: 'SI' })).status).toBe(201);
    const fourth = await create(firm.token, { name: 'P4', units: 'SI' });
    expect(fourth.status).toBe(403);
    expect(fourth.body.code).toBe('plan_limit');
    expect(await h.models.Project.count({ where: { firmId: firm.firm.id } })).toBe(3);
    await setPlan(h, firm.firm.id, 'professional', 1);
    expect((await create(firm.token, { name: 'P4', units: 'SI' })).status).toBe(201);
  });

  it('concurrent creates cannot overshoot the Concept cap', async () => {
    const firm = await signUpFirm(h, 'race');
    const results = await Promise.all(
      [1, 2, 3, 4, 5].map((i) => create(firm.token, { name: `R${i}`, units: 'SI' })),
    );
    expect(results.filter((r) => r.status === 201)).toHaveLength(3);
    expect(results.filter((r) => r.status === 403)).toHaveLength(2);
    expect(await h.models.Project.count({ where: { firmId: firm.firm.id } })).toBe(3);
  });
});

describe('GET /projects: search, sort, pagination', () => {
  let token = '';
  const seed = [
    {
      name: 'Alder Brook spillway',
      client: 'Zeta Water',
      location: 'North Vale',
      status: 'issued',
    },
    { name: 'beech culvert', client: 'alpha roads', location: 'East Fen', status: 'draft' },
    { name: 'Cedar drop 100%_done', client: 'Mid Board', location: 'West Fen', status: 'archived' },
    { name: 'Damson chute', client: 'Beta Council', location: 'South Vale', status: 'in review' },
    { name: 'Elm outlet', client: 'Gamma Trust', location: 'Upper Brook', status: 'draft' },
  ];
  beforeAll(async () => {
    const firm = await signUpFirm(h, 'list');
    await setPlan(h, firm.firm.id, 'professional', 1);
    token = firm.token;
    for (const p of seed) {
      const res = await create(token, { ...p, units: 'SI' });
      if (res.status !== 201) throw new Error(JSON.stringify(res.body));
      await new Promise((resolve) => setTimeout(resolve, 5)); // distinct timestamps
    }
  });
  const names = (body: { items: { name: string }[] }) => body.items.map((p) => p.name);

  it('defaults to the most recently changed first, 20 a page', async () => {
    const res = await list(token, {});
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ total: 5, page: 1, pageSize: 20 });
    expect(names(res.body)).toEqual(seed.map((p) => p.name).reverse());
  });

  it('searches name, client and location, case-insensitively', async () => {
    expect(names((await list(token, { search: 'BROOK' })).body).sort()).toEqual([
      'Alder Brook spillway',
      'Elm outlet',
    ]);
    expect(names((await list(token, { search: 'alpha' })).body)).toEqual(['beech culvert']);
    expect((await list(token, { search: 'fen' })).body.total).toBe(2);
    expect((await list(token, { search: 'nothing like it' })).body).toMatchObject({
      total: 0,
      items: [],
    });
  });

  it('treats % and _ in a search as plain characters', async () => {
    expect(names((await list(token, { search: '100%_' })).body)).toEqual(['Cedar drop 100%_done']);
    expect((await list(token, { search: '%' })).body.total).toBe(1);
    expect((await list(token, { search: '_' })).body.total).toBe(1);
  });

  it('sorts by name and client ignoring case, and by status in workflow order', async () => {
    expect(names((await list(token, { sort: 'name', order: 'asc' })).body)).toEqual(
      seed.map((p) => p.name),
    );
    expect(names((await list(token, { sort: 'name', order: 'desc' })).body)).toEqual(
      seed.map((p) => p.name).reverse(),
    );
    const byClient = (await list(token, { sort: 'client', order: 'asc' })).body.items.map(
      (p: { client: string }) => p.client,
    );
    expect(byClient).toEqual([
      'alpha roads',
      'Beta Council',
      'Gamma Trust',
      'Mid Board',
      'Zeta Water',
    ]);
    const byStatus = (await list(token, { sort: 'status', order: 'asc' })).body.items.map(
      (p: { status: string }) => p.status,
    );
    expect(byStatus).toEqual(['draft', 'draft', 'in review', 'issued', 'archived']);
    expect(names((await list(token, { sort: 'createdAt', order: 'asc' })).body)).toEqual(
      seed.map((p) => p.name),
    );
  });

  it('pages without overlap or gaps and reports the total', async () => {
    const seen: string[] = [];
    for (const page of [1, 2, 3]) {
      const res = await list(token, { sort: 'name', order: 'asc', page, pageSize: 2 });
      expect(res.body).toMatchObject({ total: 5, page, pageSize: 2 });
      seen.push(...names(res.body));
    }
    expect(seen).toEqual(seed.map((p) => p.name));
    expect((await list(token, { page: 4, pageSize: 2 })).body).toMatchObject({
      items: [],
      total: 5,
    });
    // A full last page and the empty one after it (the total is counted, not inferred).
    expect((await list(token, { page: 1, pageSize: 5 })).body.total).toBe(5);
    expect((await list(token, { page: 2, pageSize: 5 })).body).toMatchObject({
      items: [],
      total: 5,
    });
  });

  it('answers 422 for a bad query', async () => {
    const res = await list(token, { sort: 'firmId', page: 0, pageSize: 1000 });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.details).sort()).toEqual(['page', 'pageSize', 'sort']);
  });

  it('answers 422 for a search with a NUL character (no stored text can hold one)', async () => {
    const res = await list(token, { search: 'fen\u0000wick' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.details)).toEqual(['search']);
  });

  it('every role of the firm can list and read', async () => {
    const firmId = (await h.models.Project.findOne({ where: { name: seed[0]!.name } }))?.firmId;
    const viewer = await addMember(h, firmId!, 'viewer');
    expect((await list(viewer.token, {})).body.total).toBe(5);
  });
});
