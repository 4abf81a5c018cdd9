-- Spoke & Chain: depots and the couriers who ride from them.
CREATE TABLE depots (
    depot_id  integer PRIMARY KEY,
    name      text NOT NULL,
    city      text NOT NULL
);

-- A courier's depot fixes the city they ride in; depot_city is copied here for the dispatch screen.
-- normguard: fd depot_id -> depot_city
CREATE TABLE couriers (
    courier_id  integer PRIMARY KEY,
    full_name   text NOT NULL,
    depot_id    integer NOT NULL REFERENCES depots (depot_id),
    depot_city  text NOT NULL,
    phone       text UNIQUE
);

-- The depot name is already unique through depot_id; this constraint adds nothing.
ALTER TABLE depots ADD CONSTRAINT depots_id_name_key UNIQUE (depot_id, name);
