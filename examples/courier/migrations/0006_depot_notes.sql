-- Notes from the Lyon depot, saved by an old editor as Latin-1: café stop on route 7.
CREATE TABLE depot_notes (
    note_id  integer PRIMARY KEY,
    depot_id integer NOT NULL,
    body     text NOT NULL
);
