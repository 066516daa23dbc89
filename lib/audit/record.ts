import type { Transaction } from 'sequelize';
import { AuditEvent } from '@/models';

/** Appends one event to the audit log (who did what to which thing, and when). */
export async function recordEvent(
  event: {
    teamId?: number | null;
    actorId?: number | null;
    action: string;
    subjectType?: string;
    subjectId?: number;
    data?: Record<string, unknown>;
  },
  transaction?: Transaction,
): Promise<void> {
  await AuditEvent.create(
    {
      teamId: event.teamId ?? null,
      actorId: event.actorId ?? null,
      action: event.action,
      subjectType: event.subjectType ?? null,
      subjectId: event.subjectId ?? null,
      data: event.data ?? null,
    },
    { transaction },
  );
}
