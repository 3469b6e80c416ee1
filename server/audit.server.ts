// Audit trail: every change records who did what to which object.
import type { Transaction } from "sequelize";
import { AuditEvent } from "../db/models/index.ts";

export interface AuditInput {
  organisationId?: number | null;
  actorId?: number | null;
  action: string;
  objectType: string;
  objectId?: string | number | null;
  details?: Record<string, unknown>;
}

export async function audit(input: AuditInput, transaction?: Transaction) {
  await AuditEvent.create(
    {
      organisationId: input.organisationId ?? null,
      actorId: input.actorId ?? null,
      action: input.action,
      objectType: input.objectType,
      objectId: input.objectId == null ? null : String(input.objectId),
      details: input.details ?? {},
    },
    { transaction },
  );
}
