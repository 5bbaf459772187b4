CREATE TABLE "read_version" (
	"id" integer PRIMARY KEY NOT NULL,
	"version" bigint DEFAULT 0 NOT NULL,
	CONSTRAINT "read_version_one_row" CHECK ("read_version"."id" = 1)
);
