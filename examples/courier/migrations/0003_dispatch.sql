-- Each dispatcher covers exactly one zone; a courier has one dispatcher in each zone they ride.
-- normguard: fd dispatcher -> zone
CREATE TABLE zone_dispatch (
    courier_id  integer NOT NULL,
    zone        text NOT NULL,
    dispatcher  text NOT NULL,
    PRIMARY KEY (courier_id, zone)
);

-- Prices per zone and bike class (the dependency is declared in .normguard.yaml).
CREATE TABLE tariffs (
    tariff_id     integer PRIMARY KEY,
    zone          text NOT NULL,
    bike_class    text NOT NULL,
    price_per_km  numeric(6, 2) NOT NULL
);
