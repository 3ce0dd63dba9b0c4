// Bulletins (versioned, frozen once issued), review comments, and the forecast records every
// issued bulletin leaves behind for verification.
import { sql } from "drizzle-orm";
import { date, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, boolean } from "drizzle-orm/pg-core";
import { users } from "./users";

export const bulletinStatusEnum = pgEnum("bulletin_status", ["draft", "in_review", "returned", "issued", "superseded", "withdrawn"]);
export type BulletinStatus = (typeof bulletinStatusEnum.enumValues)[number];

export const bulletins = pgTable(
  "bulletins",
  {
    id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
    forecastDay: date("forecast_day", { mode: "string" }).notNull(),
    version: integer("version").notNull(),
    status: bulletinStatusEnum("status").notNull().default("draft"),
    authorId: integer("author_id").notNull().references(() => users.id),
    approverId: integer("approver_id").references(() => users.id),
    discussion: text("discussion").notNull().default(""),
    /** Frozen at issue: the full-disk grid, the region rows, and the cautions as sent. */
    content: jsonb("content").$type<Record<string, unknown> | null>(),
    issueTime: timestamp("issue_time", { withTimezone: true }),
    submittedAt: timestamp("submitted_at", { withTimezone: true }),
    withdrawnReason: text("withdrawn_reason"),
    supersedesId: integer("supersedes_id"),
    /** Optimistic concurrency: every change bumps it, so two approvals cannot both win. */
    revision: integer("revision").notNull().default(1),
    isDemo: boolean("is_demo").notNull().default(false),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("bulletins_day_version_key").on(t.forecastDay, t.version),
    // At most one open (not yet issued) bulletin per day.
    uniqueIndex("bulletins_one_open_per_day").on(t.forecastDay).where(sql`${t.status} in ('draft', 'in_review', 'returned')`),
    index("bulletins_status_idx").on(t.status),
  ],
);

export const bulletinComments = pgTable("bulletin_comments", {
  id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
  bulletinId: integer("bulletin_id").notNull().references(() => bulletins.id),
  authorId: integer("author_id").notNull().references(() => users.id),
  body: text("body").notNull(),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

/** One row per issued probability: source × issue time × region (null = full disk) × level × window. */
export const forecastRecords = pgTable(
  "forecast_records",
  {
    id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
    /** "forecaster", "model:<key>@<version>" or "external:<series id>". */
    source: text("source").notNull(),
    issueTime: timestamp("issue_time", { withTimezone: true }).notNull(),
    regionNumber: text("region_number"),
    level: text("level").notNull(),
    windowHours: integer("window_hours").notNull(),
    probability: doublePrecision("probability").notNull(),
    bulletinId: integer("bulletin_id").references(() => bulletins.id),
    isDemo: boolean("is_demo").notNull().default(false),
  },
  (t) => [index("forecast_records_source_time_idx").on(t.source, t.issueTime), index("forecast_records_time_idx").on(t.issueTime)],
);
