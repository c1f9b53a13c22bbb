-- Trigram search on names, streets and serials (pg_trgm ships with Debian's postgresql package).
CREATE EXTENSION IF NOT EXISTS pg_trgm;
