"""The audit report: where a schema stands, as a self-contained HTML page and as JSON data."""
