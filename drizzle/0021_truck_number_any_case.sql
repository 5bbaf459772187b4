ALTER TABLE "trucks" DROP CONSTRAINT "trucks_project_label";--> statement-breakpoint
CREATE UNIQUE INDEX "trucks_project_label_ci" ON "trucks" USING btree ("project_id",upper("label"));