-- Custom SQL migration file, put your code below! --
-- pg_trgm lets "contains" filters (ILIKE '%…%') on lot numbers and material names use an index,
-- which keeps the lots and materials lists fast with 100,000 rows (apps/api/bench/list-bench.ts).
CREATE EXTENSION IF NOT EXISTS pg_trgm;
