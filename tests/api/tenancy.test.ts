import { describe, expect, it } from 'vitest';
import { TOKEN_TTL_MS } from '@basinwright/common';
import {
  addMember,
  bearer,
  setPlan,
  signUpFirm,
  apiForFile,
  uniqueEmail,
} from '../support/api-app';

// Firm A's owner probes every project and member route with firm B's ids: each must answer
// exactly like an id that does not exist, leak nothing and change nothing.

let tokenA = '';
const b = {
  firmId: '',
  projectId: '',
  projectName: '',
  memberId: '',
  memberEmail: '',
  invitationId: '',
};
const MISSING = '7d1c9a3e-0000-4000-8000-000000000000';

const h = apiForFile(setUp, async () => {
  await h.models.Invitation.destroy({ where: { id: b.invitationId } });
});

async function setUp(): Promise<void> {
  const a = await signUpFirm(h, 'tenant-a');
  await setPlan(h, a.firm.id, 'firm', 10);
  tokenA = a.token;
  await h
    .http()
    .post('/api/v1/projects')
    .set(bearer(tokenA))
    .send({ name: 'A own project', units: 'SI' });

  const firmB = await signUpFirm(h, 'tenant-b');
  await setPlan(h, firmB.firm.id, 'firm', 10);
  b.firmId = firmB.firm.id;
  b.projectName = `B secret ${uniqueEmail('x')}`;
  const project = await h
    .http()
    .post('/api/v1/projects')
    .set(bearer(firmB.token))
    .send({ name: b.projectName, units: 'US', client: 'B client' });
  b.projectId = project.body.id;
  const member = await addMember(h, firmB.firm.id, 'engineer');
  b.memberId = member.id;
  b.memberEmail = member.email;
  const invitation = await h.models.Invitation.create({
    firmId: firmB.firm.id,
    email: uniqueEmail('b-invitee'),
    role: 'viewer',
    tokenHash: 'b'.repeat(64),
    expiresAt: new Date(Date.now() + TOKEN_TTL_MS.invitation),
    invitedById: firmB.user.id,
  });
  b.invitationId = invitation.id;
}

type Method = 'get' | 'patch' | 'delete';
function probe(method: Method, path: string, body?: object) {
  const agent = h.http();
  return agent[method](`/api/v1${path}`)
    .set(bearer(tokenA))
    .send(body ?? {});
}

async function expectLikeMissing(
  method: Method,
  template: string,
  foreignId: string,
  body?: object,
) {
  const foreign = await probe(method, template.replace('{id}', foreignId), body);
  const missing = await probe(method, template.replace('{id}', MISSING), body);
  expect(foreign.status).toBe(404);
  expect(foreign.body).toEqual(missing.body);
  expect(foreign.body.code).toBe('not_found');
  const text = JSON.stringify(foreign.body);
  for (const secret of [b.projectName, 'B client', b.memberEmail, b.firmId])
    expect(text).not.toContain(secret);
}

describe('cross-firm probes: projects', () => {
  it('GET /projects/:id of another firm is a 404 like a missing id', async () => {
    await expectLikeMissing('get', '/projects/{id}', b.projectId);
  });

  it('PATCH /projects/:id of another firm is a 404 and changes nothing', async () => {
    await expectLikeMissing('patch', '/projects/{id}', b.projectId, {
      name: 'hijacked',
      status: 'archived',
    });
    const project = await h.models.Project.findByPk(b.projectId);
    expect(project).toMatchObject({ name: b.projectName, status: 'draft', firmId: b.firmId });
  });

  it('DELETE /projects/:id of another firm is a 404 and deletes nothing', async () => {
    await expectLikeMissing('delete', '/projects/{id}', b.projectId);
    expect(await h.models.Project.findByPk(b.projectId)).not.toBeNull();
  });

  it('GET /projects lists and searches only the own firm', async () => {
    const all = await probe('get', '/projects');
    expect(all.body.items.map((p: { name: string }) => p.name)).toEqual(['A own project']);
    const search = await h
      .http()
      .get('/api/v1/projects')
      .query({ search: 'B secret' })
      .set(bearer(tokenA));
    expect(search.body).toMatchObject({ total: 0, items: [] });
  });

  it('POST /projects ignores a firmId in the body', async () => {
    const res = await h
      .http()
      .post('/api/v1/projects')
      .set(bearer(tokenA))
      .send({ name: 'Smuggled', units: 'SI', firmId: b.firmId });
    expect(res.status).toBe(201);
    expect((await h.models.Project.findByPk(res.body.id))?.firmId).not.toBe(b.firmId);
    expect(await h.models.Project.count({ where: { firmId: b.firmId } })).toBe(1);
  });
});

describe('cross-firm probes: members and invitations', () => {
  it('PATCH /members/:id of another firm is a 404 and changes nothing', async () => {
    await expectLikeMissing('patch', '/members/{id}', b.memberId, {
      role: 'viewer',
      active: false,
    });
    expect(await h.models.User.findByPk(b.memberId)).toMatchObject({
      role: 'engineer',
      active: true,
    });
  });

  it('DELETE /members/invitations/:id of another firm is a 404 and withdraws nothing', async () => {
    await expectLikeMissing('delete', '/members/invitations/{id}', b.invitationId);
    expect(await h.models.Invitation.findByPk(b.invitationId)).not.toBeNull();
  });

  it('GET /members and GET /members/invitations show only the own firm', async () => {
    const members = await probe('get', '/members');
    expect(members.status).toBe(200);
    expect(JSON.stringify(members.body)).not.toContain(b.memberEmail);
    const invitations = await probe('get', '/members/invitations');
    expect(invitations.body.items.map((i: { id: string }) => i.id)).not.toContain(b.invitationId);
  });
});
