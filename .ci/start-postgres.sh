#!/usr/bin/env bash
# Starts the local PostgreSQL cluster and creates the role and database the server tests use.
# Safe to run again: every step checks first. Run as root (it switches to the postgres user).
# Afterwards:
#   export PLANDESK_TEST_POSTGRES="Host=127.0.0.1;Port=5432;Username=plandesk;Password=plandesk;Database=plandesk_test"
set -euo pipefail

version="${PLANDESK_PG_VERSION:-15}"
role="plandesk"
password="plandesk"
database="plandesk_test"

as_postgres() { su postgres -c "$1"; }

if ! pg_ctlcluster "$version" main status >/dev/null 2>&1; then
  pg_ctlcluster "$version" main start
fi

for _ in $(seq 1 30); do
  if pg_isready -h 127.0.0.1 -p 5432 -q; then break; fi
  sleep 1
done
pg_isready -h 127.0.0.1 -p 5432

if [ "$(as_postgres "psql -tAc \"SELECT 1 FROM pg_roles WHERE rolname = '$role'\"")" != "1" ]; then
  as_postgres "psql -c \"CREATE ROLE $role LOGIN PASSWORD '$password' CREATEDB\""
fi
if [ "$(as_postgres "psql -tAc \"SELECT 1 FROM pg_database WHERE datname = '$database'\"")" != "1" ]; then
  as_postgres "createdb -O $role $database"
fi

echo "PostgreSQL $version is up with database $database owned by $role."
echo "export PLANDESK_TEST_POSTGRES=\"Host=127.0.0.1;Port=5432;Username=$role;Password=$password;Database=$database\""
