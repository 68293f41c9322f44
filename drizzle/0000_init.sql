CREATE TABLE "account" (
	"id" text PRIMARY KEY NOT NULL,
	"account_id" text NOT NULL,
	"provider_id" text NOT NULL,
	"user_id" text NOT NULL,
	"access_token" text,
	"refresh_token" text,
	"id_token" text,
	"access_token_expires_at" timestamp with time zone,
	"refresh_token_expires_at" timestamp with time zone,
	"scope" text,
	"password" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "session" (
	"id" text PRIMARY KEY NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"token" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"ip_address" text,
	"user_agent" text,
	"user_id" text NOT NULL,
	CONSTRAINT "session_token_unique" UNIQUE("token")
);
--> statement-breakpoint
CREATE TABLE "user" (
	"id" text PRIMARY KEY NOT NULL,
	"name" text NOT NULL,
	"email" text NOT NULL,
	"email_verified" boolean DEFAULT false NOT NULL,
	"image" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"role" text DEFAULT 'member' NOT NULL,
	"status" text DEFAULT 'pending' NOT NULL,
	"application" text,
	"place_name" text,
	"home_lat" double precision,
	"home_lon" double precision,
	CONSTRAINT "user_email_unique" UNIQUE("email"),
	CONSTRAINT "user_role_check" CHECK ("user"."role" in ('coordinator', 'member')),
	CONSTRAINT "user_status_check" CHECK ("user"."status" in ('pending', 'active', 'suspended')),
	CONSTRAINT "user_home_lat_check" CHECK ("user"."home_lat" is null or ("user"."home_lat" >= -90 and "user"."home_lat" <= 90)),
	CONSTRAINT "user_home_lon_check" CHECK ("user"."home_lon" is null or ("user"."home_lon" >= -180 and "user"."home_lon" <= 180))
);
--> statement-breakpoint
CREATE TABLE "verification" (
	"id" text PRIMARY KEY NOT NULL,
	"identifier" text NOT NULL,
	"value" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "farm_memberships" (
	"farm_id" uuid NOT NULL,
	"user_id" text NOT NULL,
	"farm_role" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "farm_memberships_farm_id_user_id_pk" PRIMARY KEY("farm_id","user_id"),
	CONSTRAINT "farm_memberships_role_check" CHECK ("farm_memberships"."farm_role" in ('lead', 'hand'))
);
--> statement-breakpoint
CREATE TABLE "farms" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"code" text NOT NULL,
	"name" text NOT NULL,
	"address" text DEFAULT '' NOT NULL,
	"directions" text DEFAULT '' NOT NULL,
	"lat" double precision NOT NULL,
	"lon" double precision NOT NULL,
	"timezone" text DEFAULT 'Europe/London' NOT NULL,
	"contact_email" text,
	"per_grower_limit" integer,
	"outline" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "farms_code_unique" UNIQUE("code"),
	CONSTRAINT "farms_lat_check" CHECK ("farms"."lat" is null or ("farms"."lat" >= -90 and "farms"."lat" <= 90)),
	CONSTRAINT "farms_lon_check" CHECK ("farms"."lon" is null or ("farms"."lon" >= -180 and "farms"."lon" <= 180)),
	CONSTRAINT "farms_code_check" CHECK ("farms"."code" ~ '^[A-Z0-9]{2,6}$'),
	CONSTRAINT "farms_per_grower_limit_check" CHECK ("farms"."per_grower_limit" is null or "farms"."per_grower_limit" > 0)
);
--> statement-breakpoint
CREATE TABLE "mother_plants" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"code" text NOT NULL,
	"farm_id" uuid NOT NULL,
	"species_id" uuid NOT NULL,
	"variety_id" uuid,
	"planting_year" integer NOT NULL,
	"lat" double precision,
	"lon" double precision,
	"bed_row" text DEFAULT '' NOT NULL,
	"role" text NOT NULL,
	"provenance" text NOT NULL,
	"parent_plant_id" uuid,
	"source_bundle_id" uuid,
	"supplier" text,
	"health_status" text DEFAULT 'clean' NOT NULL,
	"last_inspected_on" date,
	"notes" text DEFAULT '' NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"retired_at" timestamp with time zone,
	CONSTRAINT "mother_plants_code_unique" UNIQUE("code"),
	CONSTRAINT "mother_plants_role_check" CHECK ("mother_plants"."role" in ('stock_bed', 'fruiting_bush')),
	CONSTRAINT "mother_plants_provenance_check" CHECK ("mother_plants"."provenance" in ('bought', 'seed', 'exchange')),
	CONSTRAINT "mother_plants_health_check" CHECK ("mother_plants"."health_status" in ('clean', 'watch', 'hold', 'retired')),
	CONSTRAINT "mother_plants_year_check" CHECK ("mother_plants"."planting_year" between 1900 and 2200),
	CONSTRAINT "mother_plants_lat_check" CHECK ("mother_plants"."lat" is null or ("mother_plants"."lat" >= -90 and "mother_plants"."lat" <= 90)),
	CONSTRAINT "mother_plants_lon_check" CHECK ("mother_plants"."lon" is null or ("mother_plants"."lon" >= -180 and "mother_plants"."lon" <= 180)),
	CONSTRAINT "mother_plants_position_check" CHECK (("mother_plants"."lat" is null) = ("mother_plants"."lon" is null)),
	CONSTRAINT "mother_plants_not_own_parent_check" CHECK ("mother_plants"."parent_plant_id" is null or "mother_plants"."parent_plant_id" <> "mother_plants"."id"),
	CONSTRAINT "mother_plants_retired_check" CHECK (("mother_plants"."health_status" = 'retired') = ("mother_plants"."retired_at" is not null))
);
--> statement-breakpoint
CREATE TABLE "photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"plant_id" uuid,
	"finding_id" uuid,
	"file_name" text NOT NULL,
	"thumb_name" text NOT NULL,
	"mime_type" text NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"bytes" integer NOT NULL,
	"gps_lat" double precision,
	"gps_lon" double precision,
	"taken_at" timestamp with time zone,
	"caption" text,
	"uploaded_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "photos_mime_check" CHECK ("photos"."mime_type" in ('image/jpeg', 'image/png', 'image/webp')),
	CONSTRAINT "photos_size_check" CHECK ("photos"."width" > 0 and "photos"."height" > 0 and "photos"."bytes" > 0)
);
--> statement-breakpoint
CREATE TABLE "species" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"scientific_name" text NOT NULL,
	"common_name" text NOT NULL,
	"genus" text NOT NULL,
	"propagation_methods" text[] NOT NULL,
	"default_cutting_length_cm" numeric(5, 1) NOT NULL,
	"default_cutting_diameter_mm" numeric(4, 1) NOT NULL,
	"soft_tip_cm" numeric(5, 1) DEFAULT 10 NOT NULL,
	"strike_rate_prior" numeric(4, 3) NOT NULL,
	"prior_strength" integer DEFAULT 20 NOT NULL,
	"shade_tolerant" boolean DEFAULT false NOT NULL,
	"first_crop_years" integer DEFAULT 3 NOT NULL,
	"restriction_note" text,
	"notes" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "species_scientificName_unique" UNIQUE("scientific_name"),
	CONSTRAINT "species_cutting_length_check" CHECK ("species"."default_cutting_length_cm" > 0 and "species"."default_cutting_length_cm" <= 200),
	CONSTRAINT "species_cutting_diameter_check" CHECK ("species"."default_cutting_diameter_mm" > 0),
	CONSTRAINT "species_soft_tip_check" CHECK ("species"."soft_tip_cm" >= 0),
	CONSTRAINT "species_prior_check" CHECK ("species"."strike_rate_prior" > 0 and "species"."strike_rate_prior" < 1),
	CONSTRAINT "species_prior_strength_check" CHECK ("species"."prior_strength" > 0),
	CONSTRAINT "species_first_crop_check" CHECK ("species"."first_crop_years" between 1 and 15),
	CONSTRAINT "species_methods_check" CHECK (cardinality("species"."propagation_methods") > 0)
);
--> statement-breakpoint
CREATE TABLE "varieties" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"species_id" uuid NOT NULL,
	"name" text NOT NULL,
	"description" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "varieties_species_name_unique" UNIQUE("species_id","name")
);
--> statement-breakpoint
CREATE TABLE "district_notes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"author_id" text,
	"body" text NOT NULL,
	"lat" double precision,
	"lon" double precision,
	"noted_on" date NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "district_notes_body_check" CHECK (length(trim("district_notes"."body")) > 0),
	CONSTRAINT "district_notes_lat_check" CHECK ("district_notes"."lat" is null or ("district_notes"."lat" >= -90 and "district_notes"."lat" <= 90)),
	CONSTRAINT "district_notes_lon_check" CHECK ("district_notes"."lon" is null or ("district_notes"."lon" >= -180 and "district_notes"."lon" <= 180))
);
--> statement-breakpoint
CREATE TABLE "findings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"inspection_id" uuid NOT NULL,
	"pest_id" uuid NOT NULL,
	"severity" text NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	CONSTRAINT "findings_severity_check" CHECK ("findings"."severity" in ('minor', 'moderate', 'severe'))
);
--> statement-breakpoint
CREATE TABLE "inspections" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"plant_id" uuid NOT NULL,
	"inspected_on" date NOT NULL,
	"inspector_id" text,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "pests" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"code" text NOT NULL,
	"name" text NOT NULL,
	"scientific_name" text,
	"kind" text NOT NULL,
	"travels_in_wood" boolean NOT NULL,
	"genera" text[] DEFAULT '{}'::text[] NOT NULL,
	"signs" text DEFAULT '' NOT NULL,
	"advice" text DEFAULT '' NOT NULL,
	"source" text DEFAULT '' NOT NULL,
	CONSTRAINT "pests_code_unique" UNIQUE("code"),
	CONSTRAINT "pests_kind_check" CHECK ("pests"."kind" in ('pest', 'disease', 'disorder'))
);
--> statement-breakpoint
CREATE TABLE "allocation_rounds" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"season_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"status" text DEFAULT 'draft' NOT NULL,
	"inputs" jsonb,
	"solver_stats" jsonb,
	"created_by" text,
	"approved_by" text,
	"approved_at" timestamp with time zone,
	"notified_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "allocation_rounds_season_number_unique" UNIQUE("season_id","number"),
	CONSTRAINT "allocation_rounds_status_check" CHECK ("allocation_rounds"."status" in ('draft', 'proposed', 'approved', 'notified')),
	CONSTRAINT "allocation_rounds_approved_check" CHECK ("allocation_rounds"."status" not in ('approved', 'notified') or "allocation_rounds"."approved_at" is not null)
);
--> statement-breakpoint
CREATE TABLE "bundles" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"code" text,
	"round_id" uuid NOT NULL,
	"offer_id" uuid NOT NULL,
	"line_id" uuid NOT NULL,
	"plant_id" uuid NOT NULL,
	"farm_id" uuid NOT NULL,
	"grower_id" text NOT NULL,
	"cuttings" integer NOT NULL,
	"status" text DEFAULT 'reserved' NOT NULL,
	"locked" boolean DEFAULT false NOT NULL,
	"pickup_window_id" uuid,
	"distance_m" double precision,
	"collected_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "bundles_code_unique" UNIQUE("code"),
	CONSTRAINT "bundles_cuttings_check" CHECK ("bundles"."cuttings" > 0),
	CONSTRAINT "bundles_status_check" CHECK ("bundles"."status" in ('reserved', 'ready', 'collected', 'cancelled')),
	CONSTRAINT "bundles_collected_check" CHECK (("bundles"."status" = 'collected') = ("bundles"."collected_at" is not null))
);
--> statement-breakpoint
CREATE TABLE "pickup_windows" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"season_id" uuid NOT NULL,
	"farm_id" uuid NOT NULL,
	"starts_at" timestamp with time zone NOT NULL,
	"ends_at" timestamp with time zone NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	CONSTRAINT "pickup_windows_order_check" CHECK ("pickup_windows"."ends_at" > "pickup_windows"."starts_at")
);
--> statement-breakpoint
CREATE TABLE "request_lines" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"request_id" uuid NOT NULL,
	"species_id" uuid NOT NULL,
	"variety_id" uuid,
	"cuttings" integer NOT NULL,
	"substitutes_allowed" boolean DEFAULT false NOT NULL,
	"treatment" text DEFAULT 'none' NOT NULL,
	"priority" numeric(4, 2) DEFAULT 1 NOT NULL,
	"plan" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "request_lines_cuttings_check" CHECK ("request_lines"."cuttings" > 0 and "request_lines"."cuttings" <= 100000),
	CONSTRAINT "request_lines_treatment_check" CHECK ("request_lines"."treatment" in ('none', 'willow', 'hormone', 'both')),
	CONSTRAINT "request_lines_priority_check" CHECK ("request_lines"."priority" > 0 and "request_lines"."priority" <= 10)
);
--> statement-breakpoint
CREATE TABLE "seasons" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"kind" text NOT NULL,
	"hemisphere" text NOT NULL,
	"stage" text DEFAULT 'planning' NOT NULL,
	"request_deadline" timestamp with time zone NOT NULL,
	"collection_start" date NOT NULL,
	"collection_end" date NOT NULL,
	"lookback_months" integer DEFAULT 12 NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "seasons_name_unique" UNIQUE("name"),
	CONSTRAINT "seasons_kind_check" CHECK ("seasons"."kind" in ('dormant_hardwood', 'leafy_summer', 'scion')),
	CONSTRAINT "seasons_hemisphere_check" CHECK ("seasons"."hemisphere" in ('north', 'south')),
	CONSTRAINT "seasons_stage_check" CHECK ("seasons"."stage" in ('planning', 'requests_open', 'allocating', 'collections', 'closed')),
	CONSTRAINT "seasons_window_check" CHECK ("seasons"."collection_end" >= "seasons"."collection_start"),
	CONSTRAINT "seasons_lookback_check" CHECK ("seasons"."lookback_months" between 1 and 60)
);
--> statement-breakpoint
CREATE TABLE "strike_reports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"bundle_id" uuid NOT NULL,
	"reporter_id" text,
	"stuck" integer NOT NULL,
	"rooted" integer NOT NULL,
	"assessed_on" date NOT NULL,
	"treatment" text NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "strike_reports_counts_check" CHECK ("strike_reports"."stuck" > 0 and "strike_reports"."rooted" >= 0 and "strike_reports"."rooted" <= "strike_reports"."stuck"),
	CONSTRAINT "strike_reports_treatment_check" CHECK ("strike_reports"."treatment" in ('none', 'willow', 'hormone', 'both'))
);
--> statement-breakpoint
CREATE TABLE "wood_offers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"season_id" uuid NOT NULL,
	"plant_id" uuid NOT NULL,
	"shoot_count" integer,
	"mean_shoot_length_cm" numeric(6, 1),
	"direct_count" integer,
	"estimated_yield" integer NOT NULL,
	"cap_fraction" numeric(4, 3) NOT NULL,
	"offered" integer NOT NULL,
	"reserved" integer DEFAULT 0 NOT NULL,
	"withdrawn_at" timestamp with time zone,
	"withdrawn_reason" text,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "wood_offers_season_plant_unique" UNIQUE("season_id","plant_id"),
	CONSTRAINT "wood_offers_shoots_check" CHECK ("wood_offers"."shoot_count" is null or "wood_offers"."shoot_count" >= 0),
	CONSTRAINT "wood_offers_length_check" CHECK ("wood_offers"."mean_shoot_length_cm" is null or "wood_offers"."mean_shoot_length_cm" >= 0),
	CONSTRAINT "wood_offers_direct_check" CHECK ("wood_offers"."direct_count" is null or "wood_offers"."direct_count" >= 0),
	CONSTRAINT "wood_offers_basis_check" CHECK ("wood_offers"."direct_count" is not null or ("wood_offers"."shoot_count" is not null and "wood_offers"."mean_shoot_length_cm" is not null)),
	CONSTRAINT "wood_offers_cap_check" CHECK ("wood_offers"."cap_fraction" > 0 and "wood_offers"."cap_fraction" <= 1),
	CONSTRAINT "wood_offers_offered_check" CHECK ("wood_offers"."offered" >= 0 and "wood_offers"."offered" <= "wood_offers"."estimated_yield"),
	CONSTRAINT "wood_offers_reserved_check" CHECK ("wood_offers"."reserved" >= 0 and "wood_offers"."reserved" <= "wood_offers"."offered")
);
--> statement-breakpoint
CREATE TABLE "wood_requests" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"season_id" uuid NOT NULL,
	"grower_id" text NOT NULL,
	"status" text DEFAULT 'draft' NOT NULL,
	"destination_lat" double precision NOT NULL,
	"destination_lon" double precision NOT NULL,
	"destination_label" text DEFAULT '' NOT NULL,
	"max_distance_km" numeric(6, 1) NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "wood_requests_season_grower_unique" UNIQUE("season_id","grower_id"),
	CONSTRAINT "wood_requests_status_check" CHECK ("wood_requests"."status" in ('draft', 'filed', 'withdrawn')),
	CONSTRAINT "wood_requests_lat_check" CHECK ("wood_requests"."destination_lat" is null or ("wood_requests"."destination_lat" >= -90 and "wood_requests"."destination_lat" <= 90)),
	CONSTRAINT "wood_requests_lon_check" CHECK ("wood_requests"."destination_lon" is null or ("wood_requests"."destination_lon" >= -180 and "wood_requests"."destination_lon" <= 180)),
	CONSTRAINT "wood_requests_distance_check" CHECK ("wood_requests"."max_distance_km" > 0 and "wood_requests"."max_distance_km" <= 1000)
);
--> statement-breakpoint
CREATE TABLE "audit_log" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"actor_id" text,
	"entity" text NOT NULL,
	"entity_id" text NOT NULL,
	"action" text NOT NULL,
	"reason" text,
	"before" jsonb,
	"after" jsonb,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "email_log" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"kind" text NOT NULL,
	"dedupe_key" text,
	"to_address" text NOT NULL,
	"subject" text NOT NULL,
	"status" text DEFAULT 'queued' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"last_error" text,
	"related" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone,
	CONSTRAINT "email_log_dedupeKey_unique" UNIQUE("dedupe_key"),
	CONSTRAINT "email_log_status_check" CHECK ("email_log"."status" in ('queued', 'sent', 'failed'))
);
--> statement-breakpoint
CREATE TABLE "mailbox" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"message_id" text,
	"from_address" text NOT NULL,
	"to_addresses" text[] NOT NULL,
	"subject" text DEFAULT '' NOT NULL,
	"text_body" text DEFAULT '' NOT NULL,
	"html_body" text,
	"attachments" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"size_bytes" integer NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "settings" (
	"key" text PRIMARY KEY NOT NULL,
	"value" jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "account" ADD CONSTRAINT "account_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "session" ADD CONSTRAINT "session_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "farm_memberships" ADD CONSTRAINT "farm_memberships_farm_id_farms_id_fk" FOREIGN KEY ("farm_id") REFERENCES "public"."farms"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "farm_memberships" ADD CONSTRAINT "farm_memberships_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mother_plants" ADD CONSTRAINT "mother_plants_farm_id_farms_id_fk" FOREIGN KEY ("farm_id") REFERENCES "public"."farms"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mother_plants" ADD CONSTRAINT "mother_plants_species_id_species_id_fk" FOREIGN KEY ("species_id") REFERENCES "public"."species"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mother_plants" ADD CONSTRAINT "mother_plants_variety_id_varieties_id_fk" FOREIGN KEY ("variety_id") REFERENCES "public"."varieties"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mother_plants" ADD CONSTRAINT "mother_plants_parent_plant_id_mother_plants_id_fk" FOREIGN KEY ("parent_plant_id") REFERENCES "public"."mother_plants"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mother_plants" ADD CONSTRAINT "mother_plants_source_bundle_id_bundles_id_fk" FOREIGN KEY ("source_bundle_id") REFERENCES "public"."bundles"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mother_plants" ADD CONSTRAINT "mother_plants_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_plant_id_mother_plants_id_fk" FOREIGN KEY ("plant_id") REFERENCES "public"."mother_plants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_uploaded_by_user_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "varieties" ADD CONSTRAINT "varieties_species_id_species_id_fk" FOREIGN KEY ("species_id") REFERENCES "public"."species"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "district_notes" ADD CONSTRAINT "district_notes_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_inspection_id_inspections_id_fk" FOREIGN KEY ("inspection_id") REFERENCES "public"."inspections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_pest_id_pests_id_fk" FOREIGN KEY ("pest_id") REFERENCES "public"."pests"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_plant_id_mother_plants_id_fk" FOREIGN KEY ("plant_id") REFERENCES "public"."mother_plants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_inspector_id_user_id_fk" FOREIGN KEY ("inspector_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "allocation_rounds" ADD CONSTRAINT "allocation_rounds_season_id_seasons_id_fk" FOREIGN KEY ("season_id") REFERENCES "public"."seasons"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "allocation_rounds" ADD CONSTRAINT "allocation_rounds_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "allocation_rounds" ADD CONSTRAINT "allocation_rounds_approved_by_user_id_fk" FOREIGN KEY ("approved_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bundles" ADD CONSTRAINT "bundles_round_id_allocation_rounds_id_fk" FOREIGN KEY ("round_id") REFERENCES "public"."allocation_rounds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bundles" ADD CONSTRAINT "bundles_offer_id_wood_offers_id_fk" FOREIGN KEY ("offer_id") REFERENCES "public"."wood_offers"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bundles" ADD CONSTRAINT "bundles_line_id_request_lines_id_fk" FOREIGN KEY ("line_id") REFERENCES "public"."request_lines"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bundles" ADD CONSTRAINT "bundles_plant_id_mother_plants_id_fk" FOREIGN KEY ("plant_id") REFERENCES "public"."mother_plants"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bundles" ADD CONSTRAINT "bundles_farm_id_farms_id_fk" FOREIGN KEY ("farm_id") REFERENCES "public"."farms"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bundles" ADD CONSTRAINT "bundles_grower_id_user_id_fk" FOREIGN KEY ("grower_id") REFERENCES "public"."user"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bundles" ADD CONSTRAINT "bundles_pickup_window_id_pickup_windows_id_fk" FOREIGN KEY ("pickup_window_id") REFERENCES "public"."pickup_windows"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pickup_windows" ADD CONSTRAINT "pickup_windows_season_id_seasons_id_fk" FOREIGN KEY ("season_id") REFERENCES "public"."seasons"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pickup_windows" ADD CONSTRAINT "pickup_windows_farm_id_farms_id_fk" FOREIGN KEY ("farm_id") REFERENCES "public"."farms"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "request_lines" ADD CONSTRAINT "request_lines_request_id_wood_requests_id_fk" FOREIGN KEY ("request_id") REFERENCES "public"."wood_requests"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "request_lines" ADD CONSTRAINT "request_lines_species_id_species_id_fk" FOREIGN KEY ("species_id") REFERENCES "public"."species"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "request_lines" ADD CONSTRAINT "request_lines_variety_id_varieties_id_fk" FOREIGN KEY ("variety_id") REFERENCES "public"."varieties"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "seasons" ADD CONSTRAINT "seasons_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "strike_reports" ADD CONSTRAINT "strike_reports_bundle_id_bundles_id_fk" FOREIGN KEY ("bundle_id") REFERENCES "public"."bundles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "strike_reports" ADD CONSTRAINT "strike_reports_reporter_id_user_id_fk" FOREIGN KEY ("reporter_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wood_offers" ADD CONSTRAINT "wood_offers_season_id_seasons_id_fk" FOREIGN KEY ("season_id") REFERENCES "public"."seasons"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wood_offers" ADD CONSTRAINT "wood_offers_plant_id_mother_plants_id_fk" FOREIGN KEY ("plant_id") REFERENCES "public"."mother_plants"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wood_offers" ADD CONSTRAINT "wood_offers_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wood_requests" ADD CONSTRAINT "wood_requests_season_id_seasons_id_fk" FOREIGN KEY ("season_id") REFERENCES "public"."seasons"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wood_requests" ADD CONSTRAINT "wood_requests_grower_id_user_id_fk" FOREIGN KEY ("grower_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_actor_id_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "account_user_id_idx" ON "account" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "session_user_id_idx" ON "session" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "verification_identifier_idx" ON "verification" USING btree ("identifier");--> statement-breakpoint
CREATE INDEX "farm_memberships_user_idx" ON "farm_memberships" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "mother_plants_farm_idx" ON "mother_plants" USING btree ("farm_id");--> statement-breakpoint
CREATE INDEX "mother_plants_species_idx" ON "mother_plants" USING btree ("species_id","variety_id");--> statement-breakpoint
CREATE INDEX "mother_plants_health_idx" ON "mother_plants" USING btree ("health_status");--> statement-breakpoint
CREATE INDEX "mother_plants_parent_idx" ON "mother_plants" USING btree ("parent_plant_id");--> statement-breakpoint
CREATE INDEX "mother_plants_source_bundle_idx" ON "mother_plants" USING btree ("source_bundle_id");--> statement-breakpoint
CREATE INDEX "photos_plant_idx" ON "photos" USING btree ("plant_id");--> statement-breakpoint
CREATE INDEX "varieties_species_idx" ON "varieties" USING btree ("species_id");--> statement-breakpoint
CREATE INDEX "findings_inspection_idx" ON "findings" USING btree ("inspection_id");--> statement-breakpoint
CREATE INDEX "findings_pest_idx" ON "findings" USING btree ("pest_id");--> statement-breakpoint
CREATE INDEX "inspections_plant_idx" ON "inspections" USING btree ("plant_id","inspected_on");--> statement-breakpoint
CREATE INDEX "bundles_round_idx" ON "bundles" USING btree ("round_id");--> statement-breakpoint
CREATE INDEX "bundles_offer_idx" ON "bundles" USING btree ("offer_id");--> statement-breakpoint
CREATE INDEX "bundles_plant_idx" ON "bundles" USING btree ("plant_id");--> statement-breakpoint
CREATE INDEX "bundles_grower_idx" ON "bundles" USING btree ("grower_id");--> statement-breakpoint
CREATE INDEX "pickup_windows_season_farm_idx" ON "pickup_windows" USING btree ("season_id","farm_id");--> statement-breakpoint
CREATE INDEX "request_lines_request_idx" ON "request_lines" USING btree ("request_id");--> statement-breakpoint
CREATE INDEX "strike_reports_bundle_idx" ON "strike_reports" USING btree ("bundle_id");--> statement-breakpoint
CREATE INDEX "wood_offers_plant_idx" ON "wood_offers" USING btree ("plant_id");--> statement-breakpoint
CREATE INDEX "audit_log_entity_idx" ON "audit_log" USING btree ("entity","entity_id","at");--> statement-breakpoint
CREATE INDEX "email_log_status_idx" ON "email_log" USING btree ("status");--> statement-breakpoint
CREATE INDEX "mailbox_received_idx" ON "mailbox" USING btree ("received_at");