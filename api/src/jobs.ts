import PgBoss from 'pg-boss';
import { TOKEN_TTL_MS } from '@basinwright/common';
import { getConfig } from './config/env';
import { logger } from './logger';
import { accountExistsMail, passwordResetMail, sendMail, signupMail } from './mail';
import { PasswordReset, SignupRequest, User } from './models';
import { newEmailToken } from './security';

// Background jobs in PostgreSQL (pg-boss, schema `pgboss`): any API process may queue a job and
// any may run it, so nothing is lost with a process and nothing lives in memory. Mail that must
// not tell the requester anything (does this address have an account?) is decided and sent
// here, after the response, so the response path is the same for every address.

export const MAIL_QUEUE = 'mail';
/** Proposal PDFs to draw: the job holds the proposal's id (the row says the rest). */
export const PROPOSAL_QUEUE = 'proposal-render';

/** What a mail job does; the data holds no secret (tokens are made by the job itself). */
export type MailJob =
  { kind: 'password-reset'; email: string } | { kind: 'signup'; requestId: string };

let started: Promise<PgBoss> | undefined;
let workerId: string | undefined;
let proposalWorkerId: string | undefined;

/**
 * Creates a queue, again after a deadlock: two API processes starting together create the
 * same queues (and their tables) at once, and PostgreSQL then stops one of them (40P01).
 */
async function createQueue(
  instance: PgBoss,
  name: string,
  options: Omit<PgBoss.Queue, 'name'>,
): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      await instance.createQueue(name, { name, ...options });
      return;
    } catch (error) {
      const code = (error as { code?: unknown } | null)?.code;
      if (code !== '40P01' || attempt >= 5) throw error;
    }
  }
}

function boss(): Promise<PgBoss> {
  started ??= (async () => {
    const instance = new PgBoss({
      connectionString: getConfig().databaseUrl,
      schema: 'pgboss',
      max: 3,
    });
    instance.on('error', (error) => logger().error({ err: error }, 'job queue error'));
    await instance.start();
    await createQueue(instance, MAIL_QUEUE, { retryLimit: 5, retryDelay: 30, retryBackoff: true });
    // A render that fails is recorded on the proposal, not retried; a process that dies while
    // drawing leaves the job to be taken again when it expires.
    await createQueue(instance, PROPOSAL_QUEUE, {
      retryLimit: 2,
      retryDelay: 5,
      expireInSeconds: 600,
    });
    return instance;
  })();
  // A queue that failed to start is tried afresh by the next caller, not remembered as failed.
  const current = started;
  current.catch(() => {
    if (started === current) started = undefined;
  });
  return current;
}

/** Runs one mail job: looks the address up now and sends only what its owner should get. */
export async function runMailJob(job: MailJob): Promise<void> {
  if (job.kind === 'signup') {
    const request = await SignupRequest.findByPk(job.requestId);
    if (request === null || request.usedAt !== null || request.tokenHash !== null) return;
    const existing = await User.findOne({ where: { email: request.email } });
    if (existing !== null) {
      // Nothing to finish: the address's owner learns that someone tried.
      await request.update({ usedAt: new Date() });
      await sendMail(accountExistsMail(existing.email, existing.name));
      return;
    }
    const { token, tokenHash } = newEmailToken();
    await request.update({ tokenHash });
    await sendMail(signupMail(request.email, request.name, request.firmName, token));
    return;
  }
  const user = await User.findOne({ where: { email: job.email, active: true } });
  if (user === null) return; // nobody to tell; the requester was answered alike anyway
  const { token, tokenHash } = newEmailToken();
  await PasswordReset.create({
    userId: user.id,
    tokenHash,
    expiresAt: new Date(Date.now() + TOKEN_TTL_MS.passwordReset),
  });
  await sendMail(passwordResetMail(user.email, user.name, token));
}

/** Starts this process's mail worker (idempotent); server.ts calls it at boot. */
export async function startMailWorker(): Promise<void> {
  const instance = await boss();
  workerId ??= await instance.work<MailJob>(
    MAIL_QUEUE,
    { pollingIntervalSeconds: 2 },
    async (jobs) => {
      for (const job of jobs) await runMailJob(job.data);
    },
  );
}

/**
 * Queues a mail job and wakes this process's worker (started on first use), so the mail goes
 * out promptly; the worker of any other process would pick it up too.
 */
export async function queueMail(job: MailJob): Promise<void> {
  const instance = await boss();
  await instance.send(MAIL_QUEUE, job);
  await startMailWorker();
  if (workerId !== undefined) instance.notifyWorker(workerId);
}

/**
 * Starts this process's proposal worker (idempotent): one job at a time, drawn in the
 * proposal worker thread (modules/proposals/proposal.pool.ts).
 */
export async function startProposalWorker(): Promise<void> {
  const instance = await boss();
  const { runProposalJob } = await import('./modules/proposals/proposals.service');
  proposalWorkerId ??= await instance.work<{ proposalId: string }>(
    PROPOSAL_QUEUE,
    { pollingIntervalSeconds: 2, batchSize: 1 },
    async (jobs) => {
      for (const job of jobs) await runProposalJob(job.data.proposalId);
    },
  );
}

/** Queues the drawing of a proposal and wakes this process's proposal worker. */
export async function queueProposal(proposalId: string): Promise<void> {
  const instance = await boss();
  await instance.send(PROPOSAL_QUEUE, { proposalId });
  await startProposalWorker();
  if (proposalWorkerId !== undefined) instance.notifyWorker(proposalWorkerId);
}

/** Stops the workers and closes the queue's connections (shutdown, tests). */
export async function stopJobs(): Promise<void> {
  const current = started;
  started = undefined;
  workerId = undefined;
  proposalWorkerId = undefined;
  if (current !== undefined) {
    const instance = await current.catch(() => undefined);
    await instance?.stop({ graceful: true, wait: true, timeout: 10_000 });
  }
  const { closeProposalPool } = await import('./modules/proposals/proposal.pool');
  await closeProposalPool();
}
