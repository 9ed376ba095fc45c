/**
 * The audit log of measures and their trees (who, when, before, after), and the optimistic
 * concurrency check that turns a stale write into a 409 saying what changed since.
 */
import { and, asc, desc, eq, gt } from "drizzle-orm";
import { db, type Tx } from "./db.ts";
import { measureAudit } from "../db/schema/measures.ts";
import { GavelError } from "../errors.ts";
import type { Actor } from "./http.ts";

export type AuditEntity = "measure" | "amendment" | "override";

export interface AuditEntry {
  measureId: string;
  entity: AuditEntity;
  entityId: string;
  action: string;
  version: number;
  before: Record<string, unknown> | null;
  after: Record<string, unknown> | null;
}

export async function recordAudit(tx: Tx, actor: Actor, e: AuditEntry): Promise<void> {
  await tx.insert(measureAudit).values({ chamberId: actor.chamber.id, ...e, actorId: actor.user.id, actorName: actor.user.name });
}

/** Field names whose values differ between two snapshots. */
export function changedFields(before: Record<string, unknown> | null, after: Record<string, unknown> | null): string[] {
  const keys = new Set([...Object.keys(before ?? {}), ...Object.keys(after ?? {})]);
  return [...keys].filter((k) => k !== "version" && k !== "updatedAt" && JSON.stringify(before?.[k] ?? null) !== JSON.stringify(after?.[k] ?? null)).sort();
}

/**
 * Refuse a write based on `basedOn` when the row is now at `current`: 409 with every change
 * recorded since (who, when, which fields), so the editor can reload and redo theirs.
 */
export async function assertFresh(tx: Tx, what: { entity: AuditEntity; entityId: string; label: string }, basedOn: number, current: number): Promise<void> {
  if (basedOn === current) return;
  const since = await tx
    .select({ version: measureAudit.version, action: measureAudit.action, actorName: measureAudit.actorName, at: measureAudit.at, before: measureAudit.before, after: measureAudit.after })
    .from(measureAudit)
    .where(and(eq(measureAudit.entityId, what.entityId), gt(measureAudit.version, basedOn)))
    .orderBy(asc(measureAudit.version));
  const changes = since.map((c) => ({ version: c.version, action: c.action, by: c.actorName, at: c.at.toISOString(), fields: changedFields(c.before as Record<string, unknown> | null, c.after as Record<string, unknown> | null) }));
  const summary = changes.length ? changes.map((c) => `${c.by} ${c.action}${c.fields.length ? ` (${c.fields.join(", ")})` : ""}`).join("; ") : "it was changed";
  throw new GavelError("conflict", `${what.label} changed since you opened it (your version ${basedOn}, now ${current}): ${summary}. Reload, check the changes, and make your edit again.`, {
    issues: [{ path: "version", message: `stale: based on ${basedOn}, current ${current}` }],
    details: { entity: what.entity, id: what.entityId, basedOn, current, changes },
  });
}

export async function auditOf(chamberId: string, measureId: string, limit = 200) {
  return db
    .select({ id: measureAudit.id, entity: measureAudit.entity, entityId: measureAudit.entityId, action: measureAudit.action, version: measureAudit.version, actorName: measureAudit.actorName, at: measureAudit.at, before: measureAudit.before, after: measureAudit.after })
    .from(measureAudit)
    .where(and(eq(measureAudit.chamberId, chamberId), eq(measureAudit.measureId, measureId)))
    .orderBy(desc(measureAudit.at), desc(measureAudit.version))
    .limit(limit);
}
