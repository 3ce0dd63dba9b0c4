// Append-only audit trail; a database trigger (see drizzle/*_audit_append_only.sql) refuses
// UPDATE and DELETE so no code path can rewrite history.
import { bigint, index, integer, jsonb, pgTable, text, timestamp } from "drizzle-orm/pg-core";

export const auditEvents = pgTable(
  "audit_events",
  {
    id: bigint("id", { mode: "number" }).primaryKey().generatedAlwaysAsIdentity(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    actorUserId: integer("actor_user_id"),
    actorEmail: text("actor_email"),
    action: text("action").notNull(),
    targetType: text("target_type"),
    targetId: text("target_id"),
    details: jsonb("details").$type<Record<string, unknown>>().notNull().default({}),
    ip: text("ip"),
  },
  (t) => [index("audit_events_at_idx").on(t.at), index("audit_events_action_idx").on(t.action, t.at)],
);
