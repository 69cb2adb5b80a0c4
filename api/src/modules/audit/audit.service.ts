import type { AuditAction } from '@basinwright/common';
import type { Transaction } from 'sequelize';
import { AuditEvent, type User } from '../../models';
import { getProject } from '../projects/projects.service';

export interface AuditEntry {
  firmId: string;
  projectId?: string | null;
  versionId?: string | null;
  /** who did it; a background step (a proposal drawn) names the member who asked for it */
  actor: Pick<User, 'name'> & { id: string | null };
  action: AuditAction;
  /** a plain sentence of what happened */
  summary: string;
  detail?: Record<string, unknown> | null;
}

/** Records one step in the firm's audit trail, inside the caller's transaction (so it lands with the change or not at all). */
export async function recordAudit(entry: AuditEntry, transaction: Transaction): Promise<void> {
  await AuditEvent.create(
    {
      firmId: entry.firmId,
      projectId: entry.projectId ?? null,
      versionId: entry.versionId ?? null,
      actorId: entry.actor.id,
      actorName: entry.actor.name,
      action: entry.action,
      summary: entry.summary,
      detail: entry.detail ?? null,
    },
    { transaction },
  );
}

/** Every step on one of the firm's projects, oldest first (404 for another firm's project). */
export async function listProjectAudit(firmId: string, projectId: string): Promise<AuditEvent[]> {
  await getProject(firmId, projectId);
  return AuditEvent.findAll({
    where: { firmId, projectId },
    order: [
      ['createdAt', 'ASC'],
      ['id', 'ASC'],
    ],
  });
}

/** The firm's latest steps, newest first. */
export const FIRM_AUDIT_LIMIT = 200;
export async function listFirmAudit(firmId: string): Promise<AuditEvent[]> {
  return AuditEvent.findAll({
    where: { firmId },
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: FIRM_AUDIT_LIMIT,
  });
}
