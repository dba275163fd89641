-- The lab-run workers' own database role: what a worker needs and nothing else. db/pg.sh
-- `worker-role` runs this (as the superuser, in the app's database) after the migrations, with
-- psql variables :worker (the role) and :owner (the app role that owns the tables). A worker reads
-- and updates the runs, writes their checkpoints and results, and works the pg-boss queue; the
-- users, their password hashes, tokens, sessions, sets and measurements stay out of its reach.

GRANT USAGE ON SCHEMA public TO :worker;
-- lab_runs: claim, progress, cancel flag, hand-back notes, end states.
GRANT SELECT, UPDATE ON public.lab_runs TO :worker;
GRANT SELECT, INSERT, DELETE ON public.lab_run_checkpoints TO :worker;
GRANT SELECT, INSERT ON public.lab_run_results TO :worker;

-- The queue: pg-boss's schema (installed by db/migrate.ts), its tables and the partitions that
-- later queues add (created by the app role, hence the default privileges for that role).
GRANT USAGE ON SCHEMA pgboss TO :worker;
GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA pgboss TO :worker;
ALTER DEFAULT PRIVILEGES FOR ROLE :owner IN SCHEMA pgboss GRANT SELECT, INSERT, UPDATE, DELETE ON TABLES TO :worker;
