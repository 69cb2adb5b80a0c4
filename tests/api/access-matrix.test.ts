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
import { fakePaymentsForFile } from '../support/fake-payments';
import { FAKE_PRICES } from '../../scripts/fake-stripe';

let firmId = '';
let ownerId = '';
let ownerToken = '';

// The billing routes call the payment service: its local stand-in runs for this file.
const pay = fakePaymentsForFile();

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
  /**
   * Prepares what the request needs; returns the concrete path, body and a check of the side
   * effect. `actor` is the member about to send it (none for the request without a token).
   */
  prepare(actor?: { id: string }): Promise<{
    url: string;
    body?: object;
    /** A multipart upload instead of a JSON body: the field and the file. */
    file?: { field: string; bytes: Buffer; filename: string; contentType: string };
    /** A multipart upload with text fields and one file (field name `file`). */
    upload?: { fields: Record<string, string>; file: Buffer; name: string };
    changed?: () => Promise<boolean>;
  }>;
  success: number;
}

/** A 2 × 2 PNG made with sharp, for the logo routes. */
async function smallPng(): Promise<Buffer> {
  const sharp = (await import('sharp')).default;
  return sharp({ create: { width: 2, height: 2, channels: 3, background: '#0f6e6e' } })
    .png()
    .toBuffer();
}

async function withLogo(): Promise<void> {
  await h.models.Firm.update(
    { logo: await smallPng(), logoType: 'image/png', logoUpdatedAt: new Date() },
    { where: { id: firmId } },
  );
}

/** Links the matrix firm to a paid subscription at the stand-in (or to none). */
async function subscribed(yes: boolean): Promise<string | null> {
  if (!yes) {
    await h.models.Firm.update({ stripeSubscriptionId: null }, { where: { id: firmId } });
    return null;
  }
  const { customer, subscription } = await pay.subscribe(firmId, 'firm', 1000);
  await h.models.Firm.update(
    { stripeCustomerId: customer, stripeSubscriptionId: subscription },
    { where: { id: firmId } },
  );
  return subscription;
}

/** Sends the case's body: JSON, or multipart when it uploads a file. */
function sendBody(
  req: ReturnType<ReturnType<typeof h.http>['get']>,
  prepared: Awaited<ReturnType<RouteCase['prepare']>>,
) {
  const { file } = prepared;
  if (file !== undefined)
    return req.attach(file.field, file.bytes, {
      filename: file.filename,
      contentType: file.contentType,
    });
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

/** A project with a saved draft (revision 1) and, when asked, version 1 issued by the owner in `state`. */
async function withVersion(state: 'not_sent' | 'in_review' | null) {
  const { computeStoredStudy } = await import('../../api/src/modules/designs/designs.service');
  const { figuresOf } = await import('@basinwright/common');
  const project = await newProject();
  const stored = computeStoredStudy(fenwickDesign);
  const design = await h.models.Design.create({
    firmId,
    projectId: project.id,
    input: fenwickDesign,
    options: null,
    updatedById: ownerId,
    ...stored,
  });
  if (state === null) return { project, design, version: null };
  const version = await h.models.DesignVersion.create({
    firmId,
    projectId: project.id,
    designId: design.id,
    number: 1,
    designRevision: design.revision,
    input: design.input,
    options: null,
    result: stored.result,
    engineVersion: stored.engineVersion,
    computedAt: stored.computedAt,
    figures: figuresOf(stored.result),
    issuedById: ownerId,
    issuedByName: 'Owner of matrix',
    reviewState: state,
    ...(state === 'in_review' ? { sentById: ownerId, sentAt: new Date() } : {}),
  });
  return { project, design, version };
}

/** The actor marked as licensed reviewer (so an allowed role's approval succeeds). */
async function markReviewer(actor: { id: string } | undefined) {
  if (actor === undefined) return;
  await h.models.ReviewerCredential.upsert({
    userId: actor.id,
    firmId,
    licenceNumber: 'M-1',
    jurisdiction: 'Matrix',
    statement: 'Reviewed in the matrix.',
    markedById: ownerId,
  });
}

/** A proposal of an issued version in `status` (done: with a stand-in PDF's bytes). */
async function withProposal(status: 'queued' | 'done') {
  const { project, version } = await withVersion('not_sent');
  const proposal = await h.models.Proposal.create({
    firmId,
    projectId: project.id,
    versionId: version!.id,
    requestedById: ownerId,
    status,
    ...(status === 'done' ? { pdf: Buffer.from('%PDF-1.7 matrix stand-in'), pages: 1 } : {}),
  });
  return { project, version: version!, proposal };
}

const versionState = async (id: string) => (await h.models.DesignVersion.findByPk(id))?.reviewState;

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
    action: 'brand.read',
    method: 'get',
    path: '/firm/brand',
    success: 200,
    prepare: async () => ({ url: '/firm/brand' }),
  },
  {
    action: 'brand.update',
    method: 'put',
    path: '/firm/brand',
    success: 200,
    prepare: async () => {
      const footer = `Footer ${uniqueEmail('f')}`;
      return {
        url: '/firm/brand',
        body: { footer },
        changed: async () => (await h.models.Firm.findByPk(firmId))?.proposalFooter === footer,
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
    action: 'versions.list',
    method: 'get',
    path: '/projects/{id}/versions',
    success: 200,
    prepare: async () => ({
      url: `/projects/${(await withVersion('not_sent')).project.id}/versions`,
    }),
  },
  {
    action: 'versions.read',
    method: 'get',
    path: '/projects/{id}/versions/{versionId}',
    success: 200,
    prepare: async () => {
      const { project, version } = await withVersion('not_sent');
      return { url: `/projects/${project.id}/versions/${version?.id}` };
    },
  },
  {
    action: 'versions.issue',
    method: 'post',
    path: '/projects/{id}/versions',
    success: 201,
    prepare: async () => {
      const { project, design } = await withVersion(null);
      return {
        url: `/projects/${project.id}/versions`,
        body: { revision: design.revision, note: 'matrix' },
        changed: async () =>
          (await h.models.DesignVersion.count({ where: { projectId: project.id } })) === 1,
      };
    },
  },
  {
    action: 'brand.logo.read',
    method: 'get',
    path: '/firm/brand/logo',
    success: 200,
    prepare: async () => {
      await withLogo();
      return { url: '/firm/brand/logo?size=64' };
    },
  },
  {
    action: 'brand.logo.upload',
    method: 'put',
    path: '/firm/brand/logo',
    success: 200,
    prepare: async () => {
      await h.models.Firm.update({ logo: null, logoType: null }, { where: { id: firmId } });
      return {
        url: '/firm/brand/logo',
        file: {
          field: 'logo',
          bytes: await smallPng(),
          filename: 'logo.png',
          contentType: 'image/png',
        },
        changed: async () => (await h.models.Firm.findByPk(firmId))?.logo !== null,
      };
    },
  },
  {
    action: 'versions.change',
    method: 'put',
    path: '/projects/{id}/versions/{versionId}',
    // an issued version never changes: whoever may issue is told so
    success: 409,
    prepare: async () => {
      const { project, version } = await withVersion('not_sent');
      return {
        url: `/projects/${project.id}/versions/${version?.id}`,
        body: { note: 'changed' },
      };
    },
  },
  {
    action: 'brand.logo.remove',
    method: 'delete',
    path: '/firm/brand/logo',
    success: 204,
    prepare: async () => {
      await withLogo();
      return {
        url: '/firm/brand/logo',
        changed: async () => (await h.models.Firm.findByPk(firmId))?.logo === null,
      };
    },
  },
  {
    action: 'versions.delete',
    method: 'delete',
    path: '/projects/{id}/versions/{versionId}',
    success: 409,
    prepare: async () => {
      const { project, version } = await withVersion('not_sent');
      return { url: `/projects/${project.id}/versions/${version?.id}` };
    },
  },
  {
    action: 'versions.send',
    method: 'post',
    path: '/projects/{id}/versions/{versionId}/send',
    success: 200,
    prepare: async () => {
      const { project, version } = await withVersion('not_sent');
      const id = version?.id ?? '';
      return {
        url: `/projects/${project.id}/versions/${id}/send`,
        changed: async () => (await versionState(id)) === 'in_review',
      };
    },
  },
  {
    action: 'versions.approve',
    method: 'post',
    path: '/projects/{id}/versions/{versionId}/approve',
    success: 200,
    prepare: async (actor) => {
      await markReviewer(actor);
      const { project, version } = await withVersion('in_review');
      const id = version?.id ?? '';
      return {
        url: `/projects/${project.id}/versions/${id}/approve`,
        body: {},
        changed: async () => (await versionState(id)) === 'approved',
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
    action: 'alternatives.export',
    method: 'get',
    path: '/projects/{id}/alternatives/export',
    success: 200,
    prepare: async () => ({
      url: `/projects/${await projectWithDesign()}/alternatives/export?format=csv`,
    }),
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
    action: 'versions.return',
    method: 'post',
    path: '/projects/{id}/versions/{versionId}/return',
    success: 200,
    prepare: async (actor) => {
      await markReviewer(actor);
      const { project, version } = await withVersion('in_review');
      const id = version?.id ?? '';
      return {
        url: `/projects/${project.id}/versions/${id}/return`,
        body: { comments: 'Check the tailwater rating.' },
        changed: async () => (await versionState(id)) === 'returned',
      };
    },
  },
  {
    action: 'reviewers.mark',
    method: 'put',
    path: '/members/{id}/reviewer',
    success: 200,
    prepare: async () => {
      const target = await addMember(h, firmId, 'engineer');
      return {
        url: `/members/${target.id}/reviewer`,
        body: { licenceNumber: 'PE-1', jurisdiction: 'Matrix', statement: 'Reviewed.' },
        changed: async () => (await h.models.ReviewerCredential.findByPk(target.id)) !== null,
      };
    },
  },
  {
    action: 'reviewers.unmark',
    method: 'delete',
    path: '/members/{id}/reviewer',
    success: 204,
    prepare: async () => {
      const target = await addMember(h, firmId, 'engineer');
      await markReviewer(target);
      return {
        url: `/members/${target.id}/reviewer`,
        changed: async () => (await h.models.ReviewerCredential.findByPk(target.id)) === null,
      };
    },
  },
  {
    action: 'billing.read',
    method: 'get',
    path: '/billing',
    success: 200,
    prepare: async () => ({ url: '/billing' }),
  },
  {
    action: 'billing.checkout',
    method: 'post',
    path: '/billing/checkout',
    success: 200,
    prepare: async () => {
      await subscribed(false);
      // 1000 seats: at least the seats the matrix's members take
      return { url: '/billing/checkout', body: { plan: 'firm', seats: 1000 } };
    },
  },
  {
    action: 'billing.seats',
    method: 'patch',
    path: '/billing/seats',
    success: 202,
    prepare: async () => {
      const sub = await subscribed(true);
      return {
        url: '/billing/seats',
        body: { seats: 999 },
        changed: async () =>
          (await pay.stripe.subscriptions.retrieve(sub ?? '')).items.data[0]?.quantity === 999,
      };
    },
  },
  {
    action: 'billing.plan',
    method: 'patch',
    path: '/billing/plan',
    success: 202,
    prepare: async () => {
      // Subscribed on Firm (1000 seats): moving to Professional keeps the seats.
      const sub = await subscribed(true);
      return {
        url: '/billing/plan',
        body: { plan: 'professional' },
        changed: async () =>
          (await pay.stripe.subscriptions.retrieve(sub ?? '')).items.data[0]?.price.id ===
          FAKE_PRICES.professional.id,
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
    action: 'billing.cancel',
    method: 'post',
    path: '/billing/cancel',
    success: 202,
    prepare: async () => {
      const sub = await subscribed(true);
      return {
        url: '/billing/cancel',
        changed: async () =>
          (await pay.stripe.subscriptions.retrieve(sub ?? '')).cancel_at_period_end,
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
    action: 'billing.resume',
    method: 'post',
    path: '/billing/resume',
    success: 202,
    prepare: async () => {
      const sub = await subscribed(true);
      await pay.stripe.subscriptions.update(sub ?? '', { cancel_at_period_end: true });
      return {
        url: '/billing/resume',
        changed: async () =>
          !(await pay.stripe.subscriptions.retrieve(sub ?? '')).cancel_at_period_end,
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
    action: 'billing.portal',
    method: 'post',
    path: '/billing/portal',
    success: 200,
    prepare: async () => {
      await subscribed(true);
      return { url: '/billing/portal' };
    },
  },
  {
    action: 'audit.project',
    method: 'get',
    path: '/projects/{id}/audit',
    success: 200,
    prepare: async () => ({ url: `/projects/${(await newProject()).id}/audit` }),
  },
  {
    action: 'audit.firm',
    method: 'get',
    path: '/audit',
    success: 200,
    prepare: async () => ({ url: '/audit' }),
  },
  {
    action: 'proposals.list',
    method: 'get',
    path: '/projects/{id}/proposals',
    success: 200,
    prepare: async () => ({ url: `/projects/${(await newProject()).id}/proposals` }),
  },
  {
    action: 'proposals.create',
    method: 'post',
    path: '/projects/{id}/proposals',
    success: 202,
    prepare: async () => {
      const { project, version } = await withVersion('not_sent');
      return {
        url: `/projects/${project.id}/proposals`,
        body: { versionId: version!.id },
        changed: async () =>
          (await h.models.Proposal.count({ where: { projectId: project.id } })) === 1,
      };
    },
  },
  {
    action: 'proposals.read',
    method: 'get',
    path: '/projects/{id}/proposals/{proposalId}',
    success: 200,
    prepare: async () => {
      const { project, proposal } = await withProposal('queued');
      return { url: `/projects/${project.id}/proposals/${proposal.id}` };
    },
  },
  {
    action: 'proposals.download',
    method: 'get',
    path: '/projects/{id}/proposals/{proposalId}/pdf',
    success: 200,
    prepare: async () => {
      const { project, proposal } = await withProposal('done');
      return { url: `/projects/${project.id}/proposals/${proposal.id}/pdf` };
    },
  },
  {
    action: 'proposals.send',
    method: 'post',
    path: '/projects/{id}/proposals/{proposalId}/send',
    success: 200,
    prepare: async () => {
      const { project, proposal } = await withProposal('done');
      return {
        url: `/projects/${project.id}/proposals/${proposal.id}/send`,
        body: { to: 'client-of-the-matrix@test.example' },
        changed: async () =>
          (await h.models.ProposalEmail.count({ where: { proposalId: proposal.id } })) === 1,
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
    const prepared = await route.prepare(member);
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
