// Active regions, their daily assessments, the model registry and stored guidance.
import { sql } from "drizzle-orm";
import {
  boolean,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
} from "drizzle-orm/pg-core";
import { users } from "./users";

export type GridJson = Record<"C+" | "M+" | "X", Record<"24h" | "48h" | "72h", number>>;

export const regions = pgTable(
  "regions",
  {
    id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
    number: text("number").notNull(),
    isDemo: boolean("is_demo").notNull().default(false),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("regions_number_key").on(sql`upper(${t.number})`)],
);

export const assessments = pgTable(
  "assessments",
  {
    id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
    regionId: integer("region_id").notNull().references(() => regions.id),
    forecastDay: date("forecast_day", { mode: "string" }).notNull(),
    location: text("location").notNull(),
    latitudeDeg: doublePrecision("latitude_deg").notNull(),
    longitudeDeg: doublePrecision("longitude_deg").notNull(),
    isLimbFlagged: boolean("is_limb_flagged").notNull().default(false),
    areaMsh: doublePrecision("area_msh"),
    spotCount: integer("spot_count"),
    mcintosh: text("mcintosh"),
    mountWilson: text("mount_wilson"),
    unsignedFluxMx: doublePrecision("unsigned_flux_mx"),
    pilLengthMm: doublePrecision("pil_length_mm"),
    logR: doublePrecision("log_r"),
    meanShearDeg: doublePrecision("mean_shear_deg"),
    freeEnergyProxy: doublePrecision("free_energy_proxy"),
    flaresC: integer("flares_c").notNull().default(0),
    flaresM: integer("flares_m").notNull().default(0),
    flaresX: integer("flares_x").notNull().default(0),
    notes: text("notes").notNull().default(""),
    blended: jsonb("blended").$type<GridJson | null>(),
    finals: jsonb("finals").$type<GridJson | null>(),
    finalReasons: jsonb("final_reasons").$type<Record<string, string>>().notNull().default({}),
    isDemo: boolean("is_demo").notNull().default(false),
    createdBy: integer("created_by").references(() => users.id),
    updatedBy: integer("updated_by").references(() => users.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("assessments_region_day_key").on(t.regionId, t.forecastDay),
    index("assessments_day_idx").on(t.forecastDay),
  ],
);

export const models = pgTable(
  "models",
  {
    id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
    key: text("key").notNull(),
    version: text("version").notNull(),
    kind: text("kind").notNull(),
    name: text("name").notNull(),
    provenance: text("provenance").notNull(),
    params: jsonb("params").notNull(),
    isActive: boolean("is_active").notNull().default(false),
    isDemo: boolean("is_demo").notNull().default(false),
    createdBy: integer("created_by").references(() => users.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("models_key_version_key").on(t.key, t.version)],
);

export const guidance = pgTable(
  "guidance",
  {
    id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
    assessmentId: integer("assessment_id").notNull().references(() => assessments.id, { onDelete: "cascade" }),
    modelId: integer("model_id").notNull().references(() => models.id),
    modelKey: text("model_key").notNull(),
    modelVersion: text("model_version").notNull(),
    /** The exact input the model scored, so the guidance can be reproduced later. */
    inputs: jsonb("inputs").notNull(),
    probabilities: jsonb("probabilities").$type<GridJson | null>(),
    flags: jsonb("flags").$type<string[]>().notNull().default([]),
    missingInputs: jsonb("missing_inputs").$type<string[]>().notNull().default([]),
    computedAt: timestamp("computed_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("guidance_assessment_model_key").on(t.assessmentId, t.modelId)],
);

export const fullDiskAdjustments = pgTable("full_disk_adjustments", {
  forecastDay: date("forecast_day", { mode: "string" }).primaryKey(),
  /** Adjusted cells only, e.g. { "M+.24h": 0.35 }, each with a reason in `reasons`. */
  values: jsonb("values").$type<Record<string, number>>().notNull().default({}),
  reasons: jsonb("reasons").$type<Record<string, string>>().notNull().default({}),
  updatedBy: integer("updated_by").references(() => users.id),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});
