-- The 'register' counter (data_versions) moves on every statement that changes mother plants,
-- farms, species or varieties: the map's features cache (server/modules/map/features-cache.ts)
-- keys its entries by it. One row update per statement, inside the writer's transaction.
INSERT INTO "data_versions" ("name", "version") VALUES ('register', 0) ON CONFLICT ("name") DO NOTHING;
--> statement-breakpoint
CREATE FUNCTION "bump_register_version"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE "data_versions" SET "version" = "version" + 1 WHERE "name" = 'register';
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER "mother_plants_register_version" AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "mother_plants" FOR EACH STATEMENT EXECUTE FUNCTION "bump_register_version"();
--> statement-breakpoint
CREATE TRIGGER "farms_register_version" AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "farms" FOR EACH STATEMENT EXECUTE FUNCTION "bump_register_version"();
--> statement-breakpoint
CREATE TRIGGER "species_register_version" AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "species" FOR EACH STATEMENT EXECUTE FUNCTION "bump_register_version"();
--> statement-breakpoint
CREATE TRIGGER "varieties_register_version" AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "varieties" FOR EACH STATEMENT EXECUTE FUNCTION "bump_register_version"();
