-- A route is an ordered list of stops; its name belongs to the route, not to each stop.
-- normguard: fd route_id -> route_name
CREATE TABLE route_stops (
    route_id    integer NOT NULL,
    stop_no     integer NOT NULL,
    route_name  text NOT NULL,
    address     text NOT NULL,
    PRIMARY KEY (route_id, stop_no)
);

-- One row per shift: who rode, on which bike, from when.
CREATE TABLE shifts (
    shift_id    integer PRIMARY KEY,
    courier_id  integer NOT NULL,
    bike_no     integer NOT NULL,
    started_at  timestamptz NOT NULL
);
