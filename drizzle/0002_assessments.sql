CREATE TABLE "assessments" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "assessments_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"region_id" integer NOT NULL,
	"forecast_day" date NOT NULL,
	"location" text NOT NULL,
	"latitude_deg" double precision NOT NULL,
	"longitude_deg" double precision NOT NULL,
	"is_limb_flagged" boolean DEFAULT false NOT NULL,
	"area_msh" double precision,
	"spot_count" integer,
	"mcintosh" text,
	"mount_wilson" text,
	"unsigned_flux_mx" double precision,
	"pil_length_mm" double precision,
	"log_r" double precision,
	"mean_shear_deg" double precision,
	"free_energy_proxy" double precision,
	"flares_c" integer DEFAULT 0 NOT NULL,
	"flares_m" integer DEFAULT 0 NOT NULL,
	"flares_x" integer DEFAULT 0 NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"blended" jsonb,
	"finals" jsonb,
	"final_reasons" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"is_demo" boolean DEFAULT false NOT NULL,
	"created_by" integer,
	"updated_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "full_disk_adjustments" (
	"forecast_day" date PRIMARY KEY NOT NULL,
	"values" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"reasons" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"updated_by" integer,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "guidance" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "guidance_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"assessment_id" integer NOT NULL,
	"model_id" integer NOT NULL,
	"model_key" text NOT NULL,
	"model_version" text NOT NULL,
	"inputs" jsonb NOT NULL,
	"probabilities" jsonb,
	"flags" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"missing_inputs" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"computed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "models" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "models_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"key" text NOT NULL,
	"version" text NOT NULL,
	"kind" text NOT NULL,
	"name" text NOT NULL,
	"provenance" text NOT NULL,
	"params" jsonb NOT NULL,
	"is_active" boolean DEFAULT false NOT NULL,
	"is_demo" boolean DEFAULT false NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "regions" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "regions_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"number" text NOT NULL,
	"is_demo" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "assessments" ADD CONSTRAINT "assessments_region_id_regions_id_fk" FOREIGN KEY ("region_id") REFERENCES "public"."regions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessments" ADD CONSTRAINT "assessments_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessments" ADD CONSTRAINT "assessments_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "full_disk_adjustments" ADD CONSTRAINT "full_disk_adjustments_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "guidance" ADD CONSTRAINT "guidance_assessment_id_assessments_id_fk" FOREIGN KEY ("assessment_id") REFERENCES "public"."assessments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "guidance" ADD CONSTRAINT "guidance_model_id_models_id_fk" FOREIGN KEY ("model_id") REFERENCES "public"."models"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "models" ADD CONSTRAINT "models_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "assessments_region_day_key" ON "assessments" USING btree ("region_id","forecast_day");--> statement-breakpoint
CREATE INDEX "assessments_day_idx" ON "assessments" USING btree ("forecast_day");--> statement-breakpoint
CREATE UNIQUE INDEX "guidance_assessment_model_key" ON "guidance" USING btree ("assessment_id","model_id");--> statement-breakpoint
CREATE UNIQUE INDEX "models_key_version_key" ON "models" USING btree ("key","version");--> statement-breakpoint
CREATE UNIQUE INDEX "regions_number_key" ON "regions" USING btree (upper("number"));