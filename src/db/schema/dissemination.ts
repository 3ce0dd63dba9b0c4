// Subscriber contacts and thresholds, the delivery outbox, and alerts with acknowledgements.
import { boolean, doublePrecision, index, integer, pgEnum, pgTable, text, timestamp, uniqueIndex } from "drizzle-orm/pg-core";
import { sql } from "drizzle-orm";
import { bulletins } from "./bulletins";
import { organisations, users } from "./users";

export const contacts = pgTable(
  "contacts",
  {
    id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
    organisationId: integer("organisation_id").notNull().references(() => organisations.id),
    userId: integer("user_id").references(() => users.id),
    name: text("name").notNull(),
    email: text("email").notNull(),
    wantsBulletins: boolean("wants_bulletins").notNull().default(true),
    unsubscribedAt: timestamp("unsubscribed_at", { withTimezone: true }),
    isDemo: boolean("is_demo").notNull().default(false),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("contacts_email_key").on(sql`lower(${t.email})`)],
);

export const alertThresholds = pgTable("alert_thresholds", {
  id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
  contactId: integer("contact_id").notNull().references(() => contacts.id, { onDelete: "cascade" }),
  level: text("level").notNull(),
  windowHours: integer("window_hours").notNull(),
  probability: doublePrecision("probability").notNull(),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

export const outboxStatusEnum = pgEnum("outbox_status", ["queued", "sending", "sent", "failed"]);

export const outbox = pgTable(
  "outbox",
  {
    id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
    kind: text("kind").notNull(),
    bulletinId: integer("bulletin_id").references(() => bulletins.id),
    alertId: integer("alert_id"),
    contactId: integer("contact_id").references(() => contacts.id),
    toEmail: text("to_email").notNull(),
    subject: text("subject").notNull(),
    html: text("html").notNull(),
    text: text("text").notNull(),
    /** Sent to the provider so a retried request never delivers twice. */
    idempotencyKey: text("idempotency_key").notNull(),
    status: outboxStatusEnum("status").notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    lastError: text("last_error"),
    providerId: text("provider_id"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("outbox_idempotency_key").on(t.idempotencyKey), index("outbox_status_next_idx").on(t.status, t.nextAttemptAt), index("outbox_bulletin_idx").on(t.bulletinId)],
);

export const alerts = pgTable(
  "alerts",
  {
    id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
    bulletinId: integer("bulletin_id").notNull().references(() => bulletins.id),
    contactId: integer("contact_id").notNull().references(() => contacts.id),
    thresholdId: integer("threshold_id").references(() => alertThresholds.id, { onDelete: "set null" }),
    level: text("level").notNull(),
    windowHours: integer("window_hours").notNull(),
    thresholdProbability: doublePrecision("threshold_probability").notNull(),
    probability: doublePrecision("probability").notNull(),
    raisedAt: timestamp("raised_at", { withTimezone: true }).notNull().defaultNow(),
    acknowledgedAt: timestamp("acknowledged_at", { withTimezone: true }),
    acknowledgedVia: text("acknowledged_via"),
    remindedAt: timestamp("reminded_at", { withTimezone: true }),
    escalatedAt: timestamp("escalated_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("alerts_bulletin_contact_threshold_key").on(t.bulletinId, t.contactId, t.level, t.windowHours), index("alerts_open_idx").on(t.acknowledgedAt)],
);
