// Observed flare event lists (with their flux convention) and uploaded external forecast series.
import { boolean, doublePrecision, index, integer, pgTable, text, timestamp, uniqueIndex } from "drizzle-orm/pg-core";
import { users } from "./users";

export const eventLists = pgTable("event_lists", {
  id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
  name: text("name").notNull(),
  /** "legacy-scaled" (GOES 8–15 operational, 0.7 applied) or "true" flux. */
  convention: text("convention").notNull(),
  uploadedBy: integer("uploaded_by").references(() => users.id),
  uploadedAt: timestamp("uploaded_at", { withTimezone: true }).notNull().defaultNow(),
  isDemo: boolean("is_demo").notNull().default(false),
});

export const flareEvents = pgTable(
  "flare_events",
  {
    id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
    listId: integer("list_id").notNull().references(() => eventLists.id),
    startTime: timestamp("start_time", { withTimezone: true }).notNull(),
    peakTime: timestamp("peak_time", { withTimezone: true }).notNull(),
    endTime: timestamp("end_time", { withTimezone: true }).notNull(),
    /** The class as the list gave it, in the list's convention. */
    originalClass: text("original_class").notNull(),
    /** Normalised true peak flux, W m⁻², 0.1–0.8 nm. */
    peakFluxTrue: doublePrecision("peak_flux_true").notNull(),
    regionNumber: text("region_number"),
    isDemo: boolean("is_demo").notNull().default(false),
    updatedBy: integer("updated_by").references(() => users.id),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("flare_events_peak_flux_key").on(t.peakTime, t.peakFluxTrue), index("flare_events_peak_idx").on(t.peakTime)],
);

export const externalSeries = pgTable("external_series", {
  id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
  name: text("name").notNull(),
  provenance: text("provenance").notNull(),
  uploadedBy: integer("uploaded_by").references(() => users.id),
  uploadedAt: timestamp("uploaded_at", { withTimezone: true }).notNull().defaultNow(),
  isDemo: boolean("is_demo").notNull().default(false),
});

export const calibrationProposals = pgTable("calibration_proposals", {
  id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
  kind: text("kind").notNull(),
  modelKey: text("model_key").notNull(),
  params: text("params").notNull(),
  report: text("report").notNull(),
  status: text("status").notNull().default("proposed"),
  proposedBy: integer("proposed_by").references(() => users.id),
  decidedBy: integer("decided_by").references(() => users.id),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  decidedAt: timestamp("decided_at", { withTimezone: true }),
});

