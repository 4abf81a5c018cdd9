-- Raw scans from the handheld scanners, one row per beep.
CREATE TABLE delivery_log (
    parcel_ref    text NOT NULL,
    courier_id    integer NOT NULL,
    scanned_at    timestamptz NOT NULL
);

-- Imported nightly from the partner network and deduplicated there.
-- normguard: allow missing-key: partner feed, rows are deduplicated by the import job
CREATE TABLE partner_scans (
    parcel_ref  text NOT NULL,
    scanned_at  timestamptz NOT NULL
);

-- normguard: fd parcel_ref => courier_id
CREATE INDEX delivery_log_parcel ON delivery_log (parcel_ref);
