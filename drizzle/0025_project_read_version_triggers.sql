-- Per-project read versions (project_read_versions, 0024): a row moves its own project's counter, found from its
-- project_id, the project's id, or its parent's (looked up at commit; the trigger's argument says which column, as in
-- server/db/read-version-tables.ts). People and companies, TRUNCATE, and rows whose project is not found (a parent
-- deleted in the same transaction) move read_version, which every cached answer also depends on. As before, each
-- counter moves once per committed transaction (the scopes already moved are kept in a transaction-local setting),
-- from constraint triggers deferred to commit, under one transaction-level advisory lock (so moving several rows
-- cannot deadlock), and its rows are never deleted, so a number is never used twice.
CREATE OR REPLACE FUNCTION read_version_bump_scope(scope uuid) RETURNS void AS $$
DECLARE
  key text := coalesce(scope::text, '*');
BEGIN
  IF position(',' || key || ',' IN coalesce(current_setting('tallyard.read_scopes_bumped', true), '')) > 0 THEN
    RETURN;
  END IF;
  -- One lock for every transaction that moves a counter, taken before its first row: two transactions moving the
  -- same rows in another order would otherwise deadlock. Held from the commit-time trigger to the commit.
  PERFORM pg_advisory_xact_lock(hashtextextended('tallyard read versions', 0));
  IF scope IS NULL THEN
    UPDATE read_version SET version = version + 1 WHERE id = 1;
  ELSE
    INSERT INTO project_read_versions (project_id, version) VALUES (scope, 1)
      ON CONFLICT (project_id) DO UPDATE SET version = project_read_versions.version + 1;
  END IF;
  PERFORM set_config('tallyard.read_scopes_bumped',
    coalesce(nullif(current_setting('tallyard.read_scopes_bumped', true), ''), ',') || key || ',', true);
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION read_version_project_of(how text, r jsonb) RETURNS uuid AS $$
BEGIN
  RETURN CASE how
    WHEN 'project_id' THEN (r->>'project_id')::uuid
    WHEN 'id' THEN (r->>'id')::uuid
    WHEN 'pay_app_id' THEN (SELECT project_id FROM pay_apps WHERE id = (r->>'pay_app_id')::uuid)
    WHEN 'dispute_id' THEN (SELECT a.project_id FROM disputes d JOIN pay_apps a ON a.id = d.pay_app_id
      WHERE d.id = (r->>'dispute_id')::uuid)
    WHEN 'tally_id' THEN (SELECT project_id FROM tallies WHERE id = (r->>'tally_id')::uuid)
    WHEN 'change_order_id' THEN (SELECT project_id FROM change_orders WHERE id = (r->>'change_order_id')::uuid)
    WHEN 'payment_id' THEN (SELECT project_id FROM payments WHERE id = (r->>'payment_id')::uuid)
    WHEN 'stored_material_id' THEN (SELECT project_id FROM stored_materials WHERE id = (r->>'stored_material_id')::uuid)
  END;
END;
$$ LANGUAGE plpgsql STABLE;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION read_version_bump() RETURNS trigger AS $$
BEGIN
  IF TG_OP = 'TRUNCATE' OR coalesce(TG_ARGV[0], 'global') = 'global' THEN
    PERFORM read_version_bump_scope(NULL);
    RETURN NULL;
  END IF;
  IF TG_OP <> 'INSERT' THEN
    PERFORM read_version_bump_scope(read_version_project_of(TG_ARGV[0], to_jsonb(OLD)));
  END IF;
  IF TG_OP <> 'DELETE' THEN
    PERFORM read_version_bump_scope(read_version_project_of(TG_ARGV[0], to_jsonb(NEW)));
  END IF;
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER project_read_versions_no_delete BEFORE DELETE ON project_read_versions
  FOR EACH ROW EXECUTE FUNCTION read_version_refuse_removal();
--> statement-breakpoint
CREATE TRIGGER project_read_versions_no_truncate BEFORE TRUNCATE ON project_read_versions
  FOR EACH STATEMENT EXECUTE FUNCTION read_version_refuse_removal();
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "user";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "user"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('global');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "companies";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "companies"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('global');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "company_members";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "company_members"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('global');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "invitations";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "invitations"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "project_members";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "project_members"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "projects";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "projects"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "bid_items";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "bid_items"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "forecasts";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "forecasts"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "tallies";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "tallies"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "tally_evidence";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "tally_evidence"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('tally_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "tally_revisions";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "tally_revisions"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('tally_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "disputes";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "disputes"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('pay_app_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "dispute_comments";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "dispute_comments"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('dispute_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "pay_apps";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "pay_apps"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "pay_app_lines";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "pay_app_lines"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('pay_app_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "pay_app_status_history";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "pay_app_status_history"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('pay_app_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "change_orders";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "change_orders"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "change_order_items";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "change_order_items"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('change_order_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "change_order_documents";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "change_order_documents"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('change_order_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "payments";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "payments"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "payment_status_history";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "payment_status_history"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('payment_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "lien_waivers";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "lien_waivers"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "bid_item_profiles";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "bid_item_profiles"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "material_sources";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "material_sources"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "trucks";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "trucks"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "truck_tickets";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "truck_tickets"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "scale_tickets";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "scale_tickets"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "force_account_sheets";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "force_account_sheets"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "pay_adjustments";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "pay_adjustments"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "pay_app_force_account_lines";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "pay_app_force_account_lines"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('pay_app_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "stored_materials";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "stored_materials"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "stored_material_movements";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "stored_material_movements"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('stored_material_id');
--> statement-breakpoint
DROP TRIGGER read_version_bump ON "surface_baselines";
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER read_version_bump AFTER INSERT OR UPDATE OR DELETE ON "surface_baselines"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION read_version_bump('project_id');
