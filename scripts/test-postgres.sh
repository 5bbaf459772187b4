#!/usr/bin/env bash
# Runs the API tests a second time on a throwaway PostgreSQL cluster on 127.0.0.1 (Debian's postgresql package),
# so both drivers pass the same tests, plus the PostgreSQL backup and restore round trip (pg_dump and pg_restore
# come with the same package) and servers migrating at once. Installs postgresql when missing and running as root.
set -euo pipefail
cd "$(dirname "$0")/.."
if ! ls -d /usr/lib/postgresql/*/bin >/dev/null 2>&1; then
  if [ "$(id -u)" = 0 ]; then
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends postgresql >/dev/null
  else
    echo "PostgreSQL is not installed: sudo apt-get install postgresql" >&2; exit 1
  fi
fi
PGBIN=$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -n 1)
# The backup round trip would skip itself without pg_dump; in this script that is a failure, not a skip.
[ -x "$PGBIN/pg_dump" ] && [ -x "$PGBIN/pg_restore" ] || { echo "pg_dump or pg_restore is missing from $PGBIN: apt-get install postgresql-client" >&2; exit 1; }
PORT=${TEST_PG_PORT:-55432}
PGDATA=$(mktemp -d /tmp/tallyard-pg-XXXXXX)
run_pg() { if [ "$(id -u)" = 0 ]; then su postgres -s /bin/bash -c "$*"; else bash -c "$*"; fi; }
[ "$(id -u)" = 0 ] && chown postgres "$PGDATA"
run_pg "$PGBIN/initdb -D $PGDATA -A trust -U postgres >/dev/null"
run_pg "$PGBIN/pg_ctl -D $PGDATA -l $PGDATA/server.log -o \"-p $PORT -k /tmp -c listen_addresses=127.0.0.1 -c fsync=off -c max_connections=200\" -w start >/dev/null"
cleanup() { run_pg "$PGBIN/pg_ctl -D $PGDATA -m immediate stop >/dev/null" || true; rm -rf "$PGDATA"; }
trap cleanup EXIT
echo "== API tests and backup round trip on PostgreSQL ($("$PGBIN/postgres" --version))"
# Test files given as arguments run alone (a quicker check of one area); without any, the whole set.
if [ $# -gt 0 ]; then set -- "$@"; else set -- tests/api tests/server/backup-restore-postgres.test.ts tests/server/migrate-concurrent.test.ts; fi
TEST_DATABASE_URL="postgresql://postgres@127.0.0.1:$PORT/postgres" npx vitest run "$@"
