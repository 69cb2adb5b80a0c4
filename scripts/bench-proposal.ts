// The proposal PDF: the time to draw the demo proposal (in its render process, the uncertainty
// run included), and /health latency while five proposals are drawn by the background job,
// against idle (target ≤ 2×).
// Load comes from a separate process (bench-load.mjs); figures are recorded for bench.mjs.
import { ENGINE_VERSION, figuresOf, runStudy, toSI } from '@basinwright/common';
import { createApp } from '../api/src/app';
import { sequelize } from '../api/src/db/sequelize';
import { queueProposal, stopJobs } from '../api/src/jobs';
import { Design, DesignVersion, Firm, Project, Proposal, User } from '../api/src/models';
import { renderInWorker } from '../api/src/modules/proposals/proposal.pool';
import { proposalSource } from '../api/src/modules/proposals/proposals.service';
import { hashPassword } from '../api/src/security';
import { fenwickDesign } from '../seed/designs';
import { record } from './bench-results';
import { BENCH_SECONDS, listen, load, median } from './bench-listen';

const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const HEALTH_CONCURRENCY = Number(process.env.BENCH_HEALTH_CONCURRENCY ?? 4);

// The demo design issued once, straight in the database (invented demo data).
const firm = await Firm.create({
  name: 'Harrow & Lune Engineering (bench)',
  plan: 'firm',
  seats: 3,
});
const owner = await User.create({
  firmId: firm.id,
  name: 'Bench engineer',
  email: `bench-proposal-${Date.now()}@bench.example`,
  passwordHash: await hashPassword('bench-password-1'),
  role: 'owner',
});
const project = await Project.create({
  firmId: firm.id,
  name: 'Fenwick Mill Pond — auxiliary spillway outlet',
  client: 'Fenwick Mill Pond Trust',
  units: 'SI',
  createdById: owner.id,
});
const result = runStudy(toSI(fenwickDesign));
const design = await Design.create({
  firmId: firm.id,
  projectId: project.id,
  input: fenwickDesign,
  options: null,
  updatedById: owner.id,
  result,
  engineVersion: ENGINE_VERSION,
  computedAt: new Date(),
});
const version = await DesignVersion.create({
  firmId: firm.id,
  projectId: project.id,
  designId: design.id,
  number: 1,
  designRevision: 1,
  input: fenwickDesign,
  options: null,
  result,
  engineVersion: ENGINE_VERSION,
  computedAt: new Date(),
  figures: figuresOf(result),
  issuedById: owner.id,
  issuedByName: owner.name,
});

// Render time of the demo proposal in the render process (the first render warms it up).
const sample = await Proposal.create({
  firmId: firm.id,
  projectId: project.id,
  versionId: version.id,
  requestedById: owner.id,
});
const source = await proposalSource(sample, new Date());
const renderMs: number[] = [];
let pages = 0;
for (let i = 0; i <= ROUNDS; i += 1) {
  const t0 = performance.now();
  const reply = await renderInWorker({ source, maxPages: 1000 });
  if (!reply.ok) throw new Error(`the demo proposal was not drawn: ${reply.message}`);
  pages = reply.pages;
  if (i > 0) renderMs.push(performance.now() - t0);
}
console.log(`demo proposal (${pages} pages) drawn in ${median(renderMs).toFixed(0)} ms`);
record({
  name: 'proposal.render.demo',
  label: 'draw the demo proposal (render process)',
  value: median(renderMs),
  unit: 'ms',
  note: `${pages} pages, median of ${ROUNDS} after a warm-up`,
});

// /health idle against /health while five proposals are drawn by the job.
const app = await listen(createApp({ webDist: null }));
const healthLoad = () => load(`${app.url}/api/v1/health`, 'GET', undefined, {}, HEALTH_CONCURRENCY);
await healthLoad();
const idleP99: number[] = [];
const busyP99: number[] = [];
for (let round = 0; round < ROUNDS; round += 1) {
  idleP99.push((await healthLoad()).p99);
  const five = await Promise.all(
    Array.from({ length: 5 }, () =>
      Proposal.create({
        firmId: firm.id,
        projectId: project.id,
        versionId: version.id,
        requestedById: owner.id,
      }),
    ),
  );
  for (const p of five) await queueProposal(p.id);
  const ids = five.map((p) => p.id);
  // measure once the first is being drawn
  while ((await Proposal.count({ where: { id: ids, status: 'rendering' } })) === 0)
    await new Promise((r) => setTimeout(r, 20));
  busyP99.push((await healthLoad()).p99);
  while ((await Proposal.count({ where: { id: ids, status: ['queued', 'rendering'] } })) > 0)
    await new Promise((r) => setTimeout(r, 100));
}
const ratio = median(busyP99.map((b, i) => b / (idleP99[i] ?? NaN)));
const how = `medians of ${ROUNDS} rounds of ${BENCH_SECONDS} s, ${HEALTH_CONCURRENCY} connections`;
console.log(`/health p99 idle:                        ${median(idleP99).toFixed(2)} ms`);
console.log(`/health p99 while five proposals render: ${median(busyP99).toFixed(2)} ms`);
console.log(
  `/health p99 while five render ÷ idle = ${ratio.toFixed(3)} (target ≤ 2) ${ratio <= 2 ? 'MET' : 'NOT MET'}`,
);
record({
  name: 'http.health.p99.duringProposals',
  label: '/health p99 while five proposals render',
  value: median(busyP99),
  unit: 'ms',
  note: how,
});
record({
  name: 'ratio.healthP99.duringProposals.vsIdle',
  label: '/health p99 while five proposals render ÷ idle',
  value: ratio,
  unit: 'ratio',
  target: { op: '<=', value: 2 },
  note: how,
});

await stopJobs();
await app.close();
await sequelize.close();
