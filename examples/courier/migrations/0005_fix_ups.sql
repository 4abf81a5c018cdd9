-- Couriers already have a phone column (0001): this migration would fail when run.
ALTER TABLE couriers ADD COLUMN phone text;

-- Written in a hurry: a comma is missing after the first column.
CREATE TABLE bike_repairs (
    repair_id integer PRIMARY KEY
    bike_no   integer NOT NULL,
    notes     text NOT NULL
);

-- Promotes an index built by hand on the production database into a constraint;
-- the parser keeps this PostgreSQL form as plain text, so normguard cannot see the key.
ALTER TABLE depots ADD CONSTRAINT depots_city_key UNIQUE USING INDEX depots_city_idx;
