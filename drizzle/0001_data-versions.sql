CREATE TABLE "data_versions" (
	"name" text PRIMARY KEY NOT NULL,
	"version" bigint DEFAULT 0 NOT NULL
);
