-- Every stored circuit moves to the element vocabulary: kinds voltage and current, a source's
-- controls named in its value (across(a, b), through(x)), the cell option "with". The whole file
-- runs in the migrator's one transaction. Cached solves are of the earlier shape: emptied.
CREATE FUNCTION pg_temp.pf_control_text(c jsonb) RETURNS text LANGUAGE sql IMMUTABLE AS $$
  SELECT CASE WHEN c ? 'element' THEN 'through(' || (c->>'element') || ')'
              ELSE 'across(' || (c->'nodes'->>0) || ', ' || (c->'nodes'->>1) || ')' END
$$;
--> statement-breakpoint
CREATE FUNCTION pg_temp.pf_gain_times(gain text, control text) RETURNS text LANGUAGE sql IMMUTABLE AS $$
  SELECT CASE WHEN btrim(gain) = '1' THEN control
              WHEN btrim(gain) = '-1' THEN '-' || control
              WHEN btrim(gain) ~ '^[A-Za-z0-9_.]+$' THEN btrim(gain) || ' * ' || control
              ELSE '(' || btrim(gain) || ') * ' || control END
$$;
--> statement-breakpoint
CREATE FUNCTION pg_temp.pf_element(e jsonb) RETURNS jsonb LANGUAGE sql IMMUTABLE AS $$
  SELECT CASE
    WHEN jsonb_typeof(e) <> 'object' THEN e
    WHEN e->>'kind' = 'vsource' THEN jsonb_set(e, '{kind}', '"voltage"')
    WHEN e->>'kind' = 'isource' THEN jsonb_set(e, '{kind}', '"current"')
    WHEN e->>'kind' IN ('vcvs', 'ccvs', 'vccs', 'cccs') AND e ? 'control' THEN
      jsonb_set(
        jsonb_set(e - 'control', '{kind}', CASE WHEN e->>'kind' IN ('vcvs', 'ccvs') THEN '"voltage"'::jsonb ELSE '"current"'::jsonb END),
        '{value}', to_jsonb(pg_temp.pf_gain_times(e->>'value', pg_temp.pf_control_text(e->'control'))))
    ELSE e END
$$;
--> statement-breakpoint
CREATE FUNCTION pg_temp.pf_map(a jsonb, f text) RETURNS jsonb LANGUAGE plpgsql IMMUTABLE AS $$
DECLARE
  out jsonb := '[]'::jsonb;
  x jsonb;
BEGIN
  IF a IS NULL OR jsonb_typeof(a) <> 'array' THEN RETURN a; END IF;
  FOR x IN SELECT value FROM jsonb_array_elements(a) LOOP
    IF f = 'element' THEN out := out || jsonb_build_array(pg_temp.pf_element(x));
    ELSIF f = 'cell' THEN
      out := out || jsonb_build_array(CASE WHEN jsonb_typeof(x) = 'object' AND x ? 'include'
        THEN (x - 'include') || jsonb_build_object('with', x->'include') ELSE x END);
    ELSE
      out := out || jsonb_build_array(CASE WHEN jsonb_typeof(x) = 'object' AND x ? 'elements'
        THEN jsonb_set(x, '{elements}', pg_temp.pf_map(x->'elements', 'element')) ELSE x END);
    END IF;
  END LOOP;
  RETURN out;
END
$$;
--> statement-breakpoint
CREATE FUNCTION pg_temp.pf_network(n jsonb) RETURNS jsonb LANGUAGE plpgsql IMMUTABLE AS $$
BEGIN
  IF n IS NULL OR jsonb_typeof(n) <> 'object' THEN RETURN n; END IF;
  IF n ? 'elements' THEN n := jsonb_set(n, '{elements}', pg_temp.pf_map(n->'elements', 'element')); END IF;
  IF n ? 'cells' THEN n := jsonb_set(n, '{cells}', pg_temp.pf_map(n->'cells', 'cell')); END IF;
  IF n ? 'cellDefinitions' THEN n := jsonb_set(n, '{cellDefinitions}', pg_temp.pf_map(n->'cellDefinitions', 'definition')); END IF;
  RETURN n;
END
$$;
--> statement-breakpoint
UPDATE "networks" SET "circuit" = pg_temp.pf_network("circuit");
--> statement-breakpoint
UPDATE "revisions" SET "circuit" = pg_temp.pf_network("circuit");
--> statement-breakpoint
UPDATE "revision_steps" SET "data" = pg_temp.pf_network("data") WHERE "kind" = 'network';
--> statement-breakpoint
UPDATE "cells" SET "definition" = pg_temp.pf_network("definition");
--> statement-breakpoint
DELETE FROM "solve_cache";
