-- An issued bulletin is frozen: only its move to superseded or withdrawn (with a reason) may
-- touch it, and no issued bulletin may be deleted. Enforced here as well as in the service.
CREATE FUNCTION "bulletins_guard_frozen"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF OLD.status IN ('issued', 'superseded', 'withdrawn') THEN
      RAISE EXCEPTION 'bulletin % is issued and cannot be deleted', OLD.id USING ERRCODE = 'insufficient_privilege';
    END IF;
    RETURN OLD;
  END IF;
  IF OLD.status IN ('superseded', 'withdrawn') THEN
    RAISE EXCEPTION 'bulletin % is % and cannot change', OLD.id, OLD.status USING ERRCODE = 'insufficient_privilege';
  END IF;
  IF OLD.status = 'issued' THEN
    IF NEW.status NOT IN ('superseded', 'withdrawn')
       OR NEW.discussion IS DISTINCT FROM OLD.discussion
       OR NEW.content IS DISTINCT FROM OLD.content
       OR NEW.issue_time IS DISTINCT FROM OLD.issue_time
       OR NEW.forecast_day IS DISTINCT FROM OLD.forecast_day
       OR NEW.version IS DISTINCT FROM OLD.version
       OR NEW.author_id IS DISTINCT FROM OLD.author_id
       OR NEW.approver_id IS DISTINCT FROM OLD.approver_id THEN
      RAISE EXCEPTION 'bulletin % is issued: only superseding or withdrawing it is allowed', OLD.id USING ERRCODE = 'insufficient_privilege';
    END IF;
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER "bulletins_frozen_update" BEFORE UPDATE OR DELETE ON "bulletins"
  FOR EACH ROW EXECUTE FUNCTION "bulletins_guard_frozen"();
