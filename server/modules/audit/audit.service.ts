import type { AuditAction, AuditEvent, AuditEventListQuery } from '@shared/schemas/audit-events';
import type { Page } from '@shared/schemas/pagination';
import type { Executor } from '@server/db/client';
import type { AppDeps } from '@server/deps';
import { newId } from '@server/lib/ids';
import type { Actor } from '@server/http/principal';
import { decodeCursor, toPage } from '@server/http/pagination';
import { insertAuditEvent, listAuditEvents, type AuditEventRow } from './audit.repo';

export interface AuditEntry {
  action: AuditAction;
  objectType: string;
  objectId: string;
  details?: Record<string, unknown>;
}

/** Call inside the transaction that makes the change, so the log and the data never disagree. */
export async function recordAuditEvent(db: Executor, organisationId: string, actor: Actor, entry: AuditEntry, at: Date): Promise<void> {
  await insertAuditEvent(db, organisationId, {
    id: newId('auditEvent'),
    actorType: actor.type,
    actorId: actor.id,
    actorLabel: actor.label.slice(0, 100),
    action: entry.action,
    objectType: entry.objectType,
    objectId: entry.objectId,
    details: entry.details ?? {},
    createdAt: at,
  });
}

/**
 * Records the entry when the change has an actor (a request's principal); changes made by the system itself (the
 * demo seed, the dispatcher) pass none and are not logged as someone's action.
 */
export async function recordAuditEventBy(db: Executor, organisationId: string, actor: Actor | undefined, entry: AuditEntry, at: Date): Promise<void> {
  if (actor) await recordAuditEvent(db, organisationId, actor, entry, at);
}

function presentAuditEvent(row: AuditEventRow): AuditEvent {
  return {
    id: row.id,
    action: row.action as AuditAction,
    actor: { type: row.actorType, id: row.actorId, label: row.actorLabel },
    objectType: row.objectType,
    objectId: row.objectId,
    createdAt: row.createdAt.toISOString(),
    details: row.details,
  };
}

export async function listAuditEventsPage(deps: AppDeps, organisationId: string, query: AuditEventListQuery): Promise<Page<AuditEvent>> {
  const binding = { list: 'audit-events', organisationId, action: query.action, objectId: query.objectId };
  const after = decodeCursor(deps, binding, query.cursor);
  const rows = await listAuditEvents(deps.db, organisationId, { ...query, after });
  return toPage(deps, binding, rows, query.limit, (row) => row, presentAuditEvent);
}
