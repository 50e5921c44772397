import { db } from './db/client';
import { auditEntries } from './db/schema';

export interface AuditInput {
  actor: { id: string; email: string } | null;
  action: string;
  targetType?: string;
  targetId?: string;
  detail?: Record<string, unknown>;
  ip?: string | null;
}

/** Appends one audit entry. Actions are dotted verbs: auth.sign-in, record.create, calculation.recompute, ... */
export function recordAudit(entry: AuditInput): void {
  db()
    .insert(auditEntries)
    .values({
      at: new Date(),
      actorId: entry.actor?.id ?? null,
      actorLabel: entry.actor?.email ?? 'system',
      action: entry.action,
      targetType: entry.targetType ?? null,
      targetId: entry.targetId ?? null,
      detail: entry.detail ?? null,
      ip: entry.ip ?? null,
    })
    .run();
}
