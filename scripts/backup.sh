#!/usr/bin/env bash
# Backup of Sidecheck: the database (pg_dump, custom format) and the stored files folder (tar),
# written into a new timestamped folder with a manifest of SHA-256 sums (SHA256SUMS).
#   scripts/backup.sh [parent folder]            (default .data/backups; prints the folder made)
# Environment:
#   BACKUP_DATABASE_URL  a superuser URL of the database. Tenant tables FORCE row-level security,
#                        so only a superuser (or a BYPASSRLS role) can dump every row. Default:
#                        PG_SUPERUSER_URL, else the private cluster's (PG_DIR, PG_PORT, PG_DB as in
#                        scripts/pg-cluster.sh).
#   SIDECHECK_DATA_DIR   the stored files folder (default .data/files), as the server uses it.
# The dump is one consistent snapshot, taken while the server keeps running; files are copied
# after it, so the tar may hold files of uploads newer than the dump (harmless: nothing refers to
# them). Roles are not in the dump: scripts/restore.sh recreates the application role.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DB_URL="${BACKUP_DATABASE_URL:-${PG_SUPERUSER_URL:-}}"
if [ -z "$DB_URL" ]; then DB_URL="$(bash "$ROOT/scripts/pg-cluster.sh" superuser-url)"; fi
DATA_DIR="${SIDECHECK_DATA_DIR:-$ROOT/.data/files}"
PARENT="$(realpath -m "${1:-$ROOT/.data/backups}")"

# The newest pg_dump installed (a dump from an older pg_dump than the server is refused).
PG_DUMP="$(ls -d /usr/lib/postgresql/*/bin/pg_dump 2>/dev/null | sort -V | tail -n 1)"
PG_DUMP="${PG_DUMP:-$(command -v pg_dump)}"

mkdir -p "$PARENT"
STAMP="$(date -u +%Y%m%dT%H%M%SZ)"
OUT="$PARENT/sidecheck-$STAMP"
n=1
while [ -e "$OUT" ] || [ -e "$OUT.partial" ]; do OUT="$PARENT/sidecheck-$STAMP-$n"; n=$((n + 1)); done
WORK="$OUT.partial"
mkdir -m 700 "$WORK"
trap 'rm -rf "$WORK"' EXIT

"$PG_DUMP" --format=custom --compress=6 --no-password --file="$WORK/database.dump" --dbname="$DB_URL"

# Files being received (.incoming) or written (.partial) are not stored files yet.
if [ -d "$DATA_DIR" ]; then
  tar --create --gzip --file="$WORK/files.tar.gz" --directory="$DATA_DIR" \
    --exclude=./.incoming --exclude=./.partial .
else
  echo "backup: $DATA_DIR does not exist; the files archive is empty" >&2
  tar --create --gzip --file="$WORK/files.tar.gz" --files-from=/dev/null
fi

{
  echo "created: $(date -u +%Y-%m-%dT%H:%M:%SZ)"
  echo "database: $(psql "$DB_URL" -qtAX -c 'SELECT current_database()')"
  echo "server: $(psql "$DB_URL" -qtAX -c 'SHOW server_version')"
  echo "pg_dump: $("$PG_DUMP" --version)"
  echo "files: $(tar --list --gzip --file="$WORK/files.tar.gz" | grep -vc '/$' || true)"
} > "$WORK/backup-info.txt"
(cd "$WORK" && sha256sum database.dump files.tar.gz backup-info.txt > SHA256SUMS)

mv "$WORK" "$OUT"
trap - EXIT
echo "$OUT"
