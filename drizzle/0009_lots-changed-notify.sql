-- Every write that can change what the public lot list shows (a lot, its stock, its price breaks,
-- its photos) announces itself once per statement, after commit, on the lots_changed channel:
-- each server keeps the list in memory and drops it on this notice.
CREATE FUNCTION restday_notify_lots_changed() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM pg_notify('lots_changed', '');
  RETURN NULL;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER lots_changed AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON lots FOR EACH STATEMENT EXECUTE FUNCTION restday_notify_lots_changed();
--> statement-breakpoint
CREATE TRIGGER lot_price_breaks_changed AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON lot_price_breaks FOR EACH STATEMENT EXECUTE FUNCTION restday_notify_lots_changed();
--> statement-breakpoint
CREATE TRIGGER uploads_changed AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON uploads FOR EACH STATEMENT EXECUTE FUNCTION restday_notify_lots_changed();
