#!/usr/bin/env bash
# Private PostgreSQL cluster for Sidecheck, on 127.0.0.1 only, data in a git-ignored folder.
#   scripts/pg-cluster.sh start|stop|status|url|destroy
# Environment: PG_DIR (default .data/pg), PG_PORT (default 54610), PG_DB (default sidecheck).
# When run as root the cluster runs as the unprivileged "postgres" user (initdb refuses root).
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
PG_DIR="$(realpath -m "${PG_DIR:-$ROOT/.data/pg}")"
PG_PORT="${PG_PORT:-54610}"
PG_DB="${PG_DB:-sidecheck}"
PG_APP_USER="sidecheck"
DATA="$PG_DIR/data"
SOCK="$PG_DIR/socket"
PWFILE="$PG_DIR/app-password"

pg_bin() {
  local dir
  for dir in /usr/lib/postgresql/*/bin; do
    if [ -x "$dir/initdb" ]; then echo "$dir"; return 0; fi
  done
  command -v initdb >/dev/null 2>&1 && dirname "$(command -v initdb)" && return 0
  return 1
}

ensure_postgres_installed() {
  if ! pg_bin >/dev/null; then
    echo "PostgreSQL server binaries not found: installing Debian's postgresql package..." >&2
    if [ "$(id -u)" -ne 0 ]; then echo "Run as root, or install postgresql yourself." >&2; exit 1; fi
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -q >/dev/null
    apt-get install -y -q postgresql >/dev/null
    # The Debian package starts its own cluster on 5432; we leave it alone and never use it.
  fi
}

as_owner() {
  if [ "$(id -u)" -eq 0 ]; then
    (cd / && runuser -u postgres -- "$@")
  else
    "$@"
  fi
}

init_cluster() {
  local bin; bin="$(pg_bin)"
  mkdir -p "$PG_DIR"
  if [ "$(id -u)" -eq 0 ]; then
    id postgres >/dev/null 2>&1 || useradd --system --home-dir /var/lib/postgresql --shell /bin/bash postgres
    chown postgres: "$PG_DIR"
  fi
  chmod 700 "$PG_DIR"
  local superpw; superpw="$(head -c 24 /dev/urandom | od -An -tx1 | tr -d ' \n')"
  local apppw; apppw="$(head -c 24 /dev/urandom | od -An -tx1 | tr -d ' \n')"
  printf '%s' "$superpw" > "$PG_DIR/superuser-password"
  printf '%s' "$apppw" > "$PWFILE"
  [ "$(id -u)" -eq 0 ] && chown postgres: "$PG_DIR/superuser-password" "$PWFILE"
  chmod 600 "$PG_DIR/superuser-password" "$PWFILE"
  as_owner "$bin/initdb" -D "$DATA" -U postgres --pwfile="$PG_DIR/superuser-password" \
    --auth-local=scram-sha-256 --auth-host=scram-sha-256 -E UTF8 --locale=C.UTF-8 >/dev/null
  mkdir -p "$SOCK"; [ "$(id -u)" -eq 0 ] && chown postgres: "$SOCK"
}

is_running() {
  [ -f "$DATA/postmaster.pid" ] && as_owner "$(pg_bin)/pg_ctl" -D "$DATA" status >/dev/null 2>&1
}

start_cluster() {
  ensure_postgres_installed
  [ -f "$DATA/PG_VERSION" ] || init_cluster
  if ! is_running; then
    as_owner "$(pg_bin)/pg_ctl" -D "$DATA" -l "$PG_DIR/server.log" -w -t 60 \
      -o "-c listen_addresses=127.0.0.1 -p $PG_PORT -k $SOCK -c max_connections=200 -c fsync=${PG_FSYNC:-on}" \
      start >/dev/null
  fi
  local apppw; apppw="$(cat "$PWFILE")"
  # Create the unprivileged application role and its database once (idempotent).
  PGPASSWORD="$(cat "$PG_DIR/superuser-password")" psql -h 127.0.0.1 -p "$PG_PORT" -U postgres -d postgres -qtAX \
    -v ON_ERROR_STOP=1 -v apppw="$apppw" -v appuser="$PG_APP_USER" -v db="$PG_DB" <<'SQL' >/dev/null
SELECT format('CREATE ROLE %I LOGIN PASSWORD %L NOSUPERUSER NOBYPASSRLS NOCREATEROLE', :'appuser', :'apppw')
  WHERE NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = :'appuser') \gexec
SELECT format('CREATE DATABASE %I OWNER %I', :'db', :'appuser')
  WHERE NOT EXISTS (SELECT 1 FROM pg_database WHERE datname = :'db') \gexec
SQL
}

url() {
  printf 'postgres://%s:%s@127.0.0.1:%s/%s\n' "$PG_APP_USER" "$(cat "$PWFILE")" "$PG_PORT" "$PG_DB"
}

case "${1:-}" in
  start) start_cluster; echo "PostgreSQL running on 127.0.0.1:$PG_PORT (data in $DATA)" >&2 ;;
  stop) if is_running; then as_owner "$(pg_bin)/pg_ctl" -D "$DATA" -m fast -w stop >/dev/null; fi ;;
  restart) as_owner "$(pg_bin)/pg_ctl" -D "$DATA" -m fast -w restart \
      -o "-c listen_addresses=127.0.0.1 -p $PG_PORT -k $SOCK -c max_connections=200" >/dev/null ;;
  status) if is_running; then echo running; else echo stopped; exit 3; fi ;;
  url) url ;;
  superuser-url) printf 'postgres://postgres:%s@127.0.0.1:%s/%s\n' "$(cat "$PG_DIR/superuser-password")" "$PG_PORT" "$PG_DB" ;;
  destroy) if is_running; then as_owner "$(pg_bin)/pg_ctl" -D "$DATA" -m immediate -w stop >/dev/null || true; fi; rm -rf "$PG_DIR" ;;
  *) echo "usage: $0 start|stop|restart|status|url|superuser-url|destroy" >&2; exit 2 ;;
esac
