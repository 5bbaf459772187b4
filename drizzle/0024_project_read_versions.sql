CREATE TABLE "project_read_versions" (
	"project_id" uuid PRIMARY KEY NOT NULL,
	"version" bigint NOT NULL
);
