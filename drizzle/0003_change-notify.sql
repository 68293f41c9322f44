-- Every committed change to any table sends one notification on 'heelwood_changed' (NOTIFY
-- is delivered only on commit, once per transaction for identical payloads). The embedded
-- server listens to its own database and keeps its read cache by the count it has heard
-- (server/lib/read-cache.ts); a PostgreSQL server is read with pg_current_snapshot() instead.
-- A table added later needs its own trigger: tests/integration/read-cache.test.ts checks
-- that every table has one.
CREATE FUNCTION "notify_data_changed"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM pg_notify('heelwood_changed', '');
  RETURN NULL;
END
$$;
--> statement-breakpoint
DO $$
DECLARE t record;
BEGIN
  FOR t IN SELECT tablename FROM pg_tables WHERE schemaname = 'public' LOOP
    EXECUTE format(
      'CREATE TRIGGER %I AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON %I FOR EACH STATEMENT EXECUTE FUNCTION "notify_data_changed"()',
      t.tablename || '_notify_changed', t.tablename);
  END LOOP;
END
$$;
