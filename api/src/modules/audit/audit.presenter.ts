import type { AuditAction } from '@basinwright/common';
import type { AuditEvent } from '../../models';

export interface AuditEventView {
  id: string;
  projectId: string | null;
  versionId: string | null;
  actor: { id: string | null; name: string };
  action: AuditAction;
  summary: string;
  detail: Record<string, unknown> | null;
  at: string;
}

export function presentAuditEvent(e: AuditEvent): AuditEventView {
  return {
    id: e.id,
    projectId: e.projectId,
    versionId: e.versionId,
    actor: { id: e.actorId, name: e.actorName },
    action: e.action,
    summary: e.summary,
    detail: e.detail,
    at: e.createdAt.toISOString(),
  };
}

export function presentAuditEvents(events: AuditEvent[]): { items: AuditEventView[] } {
  return { items: events.map(presentAuditEvent) };
}
