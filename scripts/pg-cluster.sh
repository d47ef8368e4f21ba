#!/usr/bin/env bash
# Starts a throw-away PostgreSQL cluster on 127.0.0.1 and prints its DATABASE_URL.
#   scripts/pg-cluster.sh start [dir]   → prints postgres://binwright@127.0.0.1:<port>/postgres
#   scripts/pg-cluster.sh stop  [dir]
# Needs Debian's postgresql package (apt-get install postgresql). Trust authentication on
# 127.0.0.1 only, fsync off: for tests, never for real data.
set -euo pipefail
action=${1:?start or stop}
dir=${2:-/tmp/binwright-pg}
port=${PG_TEST_PORT:-54329}
bin=${PGBIN:-$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1)}
if [ -z "$bin" ] || [ ! -x "$bin/initdb" ]; then
  echo "PostgreSQL server programs not found: install Debian's postgresql package (apt-get install postgresql)." >&2
  exit 2
fi
# initdb and postgres refuse to run as root: run them as the postgres user the package creates.
as_owner() { if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi }

case "$action" in
  start)
    if [ ! -f "$dir/data/PG_VERSION" ]; then
      mkdir -p "$dir"
      [ "$(id -u)" = 0 ] && chown postgres "$dir"
      as_owner "$bin/initdb" -D "$dir/data" -U binwright --auth=trust -E UTF8 --locale=C.UTF-8 >"$dir/initdb.log"
    fi
    as_owner "$bin/pg_ctl" -D "$dir/data" -l "$dir/server.log" -w -o \
      "-p $port -k $dir -c listen_addresses=127.0.0.1 -c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=300" \
      start >/dev/null
    echo "postgres://binwright@127.0.0.1:$port/postgres"
    ;;
  stop)
    as_owner "$bin/pg_ctl" -D "$dir/data" -m fast -w stop >/dev/null || true
    rm -rf "$dir"
    ;;
  *) echo "usage: $0 start|stop [dir]" >&2; exit 2 ;;
esac
