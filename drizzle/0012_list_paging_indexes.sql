CREATE INDEX "tallies_page" ON "tallies" USING btree ("project_id","created_at","id");--> statement-breakpoint
CREATE INDEX "scale_tickets_page" ON "scale_tickets" USING btree ("project_id","created_at","id");--> statement-breakpoint
CREATE INDEX "truck_tickets_page" ON "truck_tickets" USING btree ("project_id","created_at","id");