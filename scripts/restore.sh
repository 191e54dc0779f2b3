#!/usr/bin/env bash
# Restore a backup made by scripts/backup.sh into a fresh database and an empty files folder.
#   scripts/restore.sh <backup folder>
# Environment:
#   RESTORE_DATABASE_URL  a superuser URL of an existing, empty database whose server already has
#                         the application role ("sidecheck"). Without it, the private cluster named
#                         by PG_DIR, PG_PORT and PG_DB is used (scripts/pg-cluster.sh start: created
#                         when missing, with the application role and an empty database it owns).
#   SIDECHECK_DATA_DIR    the files folder to fill (default .data/files); must be empty or missing.
# Checks the manifest first and changes nothing when a sum does not match. Refuses a database
# that already has tables or a files folder that already has files, so a restore never mixes
# with live data. Objects keep their owner (the application role), so row-level security, its
# policies and the immutability triggers work as before. Queued e-mails are restored with the
# job queue and are sent by the restored server.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
BACKUP="${1:?usage: scripts/restore.sh <backup folder>}"
BACKUP="$(realpath "$BACKUP")"
DATA_DIR="$(realpath -m "${SIDECHECK_DATA_DIR:-$ROOT/.data/files}")"

for f in SHA256SUMS database.dump files.tar.gz; do
  [ -f "$BACKUP/$f" ] || { echo "restore: $BACKUP/$f is missing" >&2; exit 1; }
done
if ! (cd "$BACKUP" && sha256sum --check --quiet --strict SHA256SUMS); then
  echo "restore: the backup does not match its SHA-256 manifest; nothing was restored" >&2
  exit 1
fi

if [ -d "$DATA_DIR" ] && [ -n "$(find "$DATA_DIR" -mindepth 1 -not -name lost+found -print -quit)" ]; then
  echo "restore: $DATA_DIR is not empty; restore into an empty files folder" >&2
  exit 1
fi

DB_URL="${RESTORE_DATABASE_URL:-}"
if [ -z "$DB_URL" ]; then
  bash "$ROOT/scripts/pg-cluster.sh" start
  DB_URL="$(bash "$ROOT/scripts/pg-cluster.sh" superuser-url)"
fi
tables="$(psql "$DB_URL" -qtAX -c "SELECT count(*) FROM pg_tables WHERE schemaname NOT IN ('pg_catalog', 'information_schema')")"
if [ "$tables" != "0" ]; then
  echo "restore: the target database already has $tables table(s); restore into a fresh database" >&2
  exit 1
fi

PG_RESTORE="$(ls -d /usr/lib/postgresql/*/bin/pg_restore 2>/dev/null | sort -V | tail -n 1)"
PG_RESTORE="${PG_RESTORE:-$(command -v pg_restore)}"
# One transaction: a failed restore leaves the database empty, ready for another attempt.
"$PG_RESTORE" --exit-on-error --single-transaction --no-password --dbname="$DB_URL" "$BACKUP/database.dump"
psql "$DB_URL" -qtAX -c 'ANALYZE' >/dev/null

mkdir -p "$DATA_DIR"
tar --extract --gzip --file="$BACKUP/files.tar.gz" --directory="$DATA_DIR" --no-same-owner
files="$(find "$DATA_DIR" -type f | wc -l)"
echo "restore: database restored from $BACKUP, $files stored file(s) in $DATA_DIR" >&2
