-- read_version (0022) grows by one in each committed transaction that writes a table a cached read depends on
-- (list and exemptions: server/db/read-version-tables.ts). The row triggers are constraint triggers deferred to
-- commit, so a writer takes the counter's row lock only for its commit, after all its other locks: no new deadlock,
-- and writers wait on each other only for that moment. The first one in a transaction bumps and marks the
-- transaction (a transaction-local setting); the rest return at once. TRUNCATE has no row triggers: a statement
-- trigger bumps at once. The row cannot be deleted, so a number is never used twice.
INSERT INTO read_version (id, version) VALUES (1, 0) ON CONFLICT (id) DO NOTHING;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION read_version_bump() RETURNS trigger AS $$
BEGIN
  IF current_setting('tallyard.read_version_bumped', true) IS DISTINCT FROM 'on' THEN
    UPDATE read_version SET version = version + 1 WHERE id = 1;
    PERFORM set_config('tallyard.read_version_bumped', 'on', true);
  END IF;
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION read_version_refuse_removal() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'read_version keeps its one row';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER read_version_no_delete BEFORE DELETE ON read_version
  FOR EACH ROW EXECUTE FUNCTION read_version_refuse_removal();
--> statement-breakpoint
CREATE TRIGGER read_version_no_truncate BEFORE TRUNCATE ON read_version
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_refuse_removal();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "user"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "user"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "companies"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "companies"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "company_members"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "company_members"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "invitations"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "invitations"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "project_members"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "project_members"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "projects"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "projects"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "bid_items"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "bid_items"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "forecasts"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "forecasts"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "tallies"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "tallies"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "tally_evidence"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "tally_evidence"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "tally_revisions"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "tally_revisions"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "disputes"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "disputes"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "dispute_comments"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "dispute_comments"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "pay_apps"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "pay_apps"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "pay_app_lines"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "pay_app_lines"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "pay_app_status_history"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "pay_app_status_history"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "change_orders"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "change_orders"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "change_order_items"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "change_order_items"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "change_order_documents"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "change_order_documents"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "payments"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "payments"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "payment_status_history"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "payment_status_history"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "lien_waivers"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "lien_waivers"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "bid_item_profiles"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "bid_item_profiles"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "material_sources"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "material_sources"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "trucks"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "trucks"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "truck_tickets"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "truck_tickets"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "scale_tickets"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "scale_tickets"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "force_account_sheets"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "force_account_sheets"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "pay_adjustments"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "pay_adjustments"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "pay_app_force_account_lines"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "pay_app_force_account_lines"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "stored_materials"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "stored_materials"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "stored_material_movements"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "stored_material_movements"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "surface_baselines"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump();
--> statement-breakpoint
CREATE TRIGGER read_version_bump_truncate AFTER TRUNCATE ON "surface_baselines"
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_bump();
