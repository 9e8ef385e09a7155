#!/usr/bin/env bash
# Shared set-up steps for start.sh, test.sh, bench.sh and db.sh. Source it; do not run it.
set -euo pipefail

REPO_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$REPO_ROOT"

log() { printf '\033[36m[downdip]\033[0m %s\n' "$*"; }
die() { printf '\033[31m[downdip]\033[0m %s\n' "$*" >&2; exit 1; }
is_root() { [ "$(id -u)" = 0 ]; }

apt_updated=0
apt_install() {
  is_root || return 1
  if [ "$apt_updated" = 0 ]; then
    DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null
    apt_updated=1
  fi
  # policy-rc.d keeps the package's own service from starting: we run our own cluster.
  printf '#!/bin/sh\nexit 101\n' >/usr/sbin/policy-rc.d && chmod +x /usr/sbin/policy-rc.d
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null
  rm -f /usr/sbin/policy-rc.d
}

# npm ci when node_modules is missing or older than the lockfile.
ensure_node_modules() {
  if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm dependencies (npm ci)"
    npm ci --no-audit --no-fund
  fi
}

# Newest installed PostgreSQL server binaries; installs Debian's package as root when missing.
find_pg_bin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1; }
ensure_postgres() {
  PG_BIN="$(find_pg_bin)"
  if [ -z "$PG_BIN" ] || [ ! -x "$PG_BIN/initdb" ]; then
    if is_root; then
      log "installing PostgreSQL (apt-get install postgresql)"
      apt_install postgresql
      PG_BIN="$(find_pg_bin)"
    else
      die "PostgreSQL server binaries not found. Install them with: sudo apt-get install -y postgresql"
    fi
  fi
  export PG_BIN
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then
    if is_root; then
      log "installing Chromium for browser tests (apt-get install chromium)"
      apt_install chromium
    else
      die "Chromium not found. Install it with: sudo apt-get install -y chromium"
    fi
  fi
}

# PostgreSQL refuses to run as root: as root the cluster belongs to the postgres user.
pg_as_owner() {
  if is_root; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi
}

# A data folder the cluster owner can reach: under the repo when possible, else under $TMPDIR.
choose_data_dir() {
  local wanted="$1" name="$2"
  mkdir -p "$(dirname "$wanted")"
  if is_root && ! (cd / && runuser -u postgres -- test -x "$(dirname "$wanted")" 2>/dev/null); then
    local base="${TMPDIR:-/tmp}/downdip-$(printf '%s' "$REPO_ROOT" | md5sum | cut -c1-8)"
    mkdir -p "$base" && chmod 755 "$base"
    wanted="$base/$name"
  fi
  printf '%s' "$wanted"
}

# pg_cluster_up DATA_DIR PORT [throwaway]: initdb if needed, start on 127.0.0.1:PORT, socket inside.
pg_cluster_up() {
  local data="$1" port="$2" mode="${3:-keep}"
  if [ ! -f "$data/PG_VERSION" ]; then
    log "creating PostgreSQL cluster in $data"
    mkdir -p "$data"
    if is_root; then chown postgres:postgres "$data"; fi
    chmod 700 "$data"
    local sync=""; [ "$mode" = throwaway ] && sync="--no-sync"
    pg_as_owner "$PG_BIN/initdb" -D "$data" -U postgres --auth-local=trust --auth-host=scram-sha-256 --encoding=UTF8 --locale=C.UTF-8 $sync >/dev/null
  fi
  local opts="-c listen_addresses=127.0.0.1 -p $port -k $data"
  if [ "$mode" = throwaway ]; then
    # Test clusters only: never for data anyone keeps.
    opts="$opts -c fsync=off -c synchronous_commit=off -c full_page_writes=off"
  fi
  # A postmaster killed outright can linger as a zombie where nothing reaps it (a container's
  # PID 1): pg_ctl and the new postmaster would both take its pid file for a live server.
  if [ -f "$data/postmaster.pid" ]; then
    local pid; pid="$(head -n 1 "$data/postmaster.pid")"
    if [ -n "$pid" ] && grep -qs '^State:[[:space:]]*Z' "/proc/$pid/status"; then
      log "removing the pid file of a dead PostgreSQL ($pid)"
      rm -f "$data/postmaster.pid" "$data"/.s.PGSQL.*
    fi
  fi
  if pg_as_owner "$PG_BIN/pg_ctl" -D "$data" status >/dev/null 2>&1; then
    log "PostgreSQL already running on 127.0.0.1:$port"
  else
    pg_as_owner "$PG_BIN/pg_ctl" -D "$data" -l "$data/server.log" -o "$opts" -w -t 60 start >/dev/null \
      || { tail -n 20 "$data/server.log" >&2; die "PostgreSQL did not start (see $data/server.log)"; }
  fi
}

pg_cluster_down() {
  local data="$1"
  if [ -f "$data/PG_VERSION" ] && pg_as_owner "$PG_BIN/pg_ctl" -D "$data" status >/dev/null 2>&1; then
    pg_as_owner "$PG_BIN/pg_ctl" -D "$data" -m fast -w stop >/dev/null || true
  fi
}

# pg_ensure_database DATA_DIR PORT DB: app role `downdip` owning DB (it must own it in PG 15).
pg_ensure_database() {
  local data="$1" port="$2" db="$3"
  local psql=("$PG_BIN/psql" -h "$data" -p "$port" -U postgres -d postgres -v ON_ERROR_STOP=1 -qtA)
  pg_as_owner "${psql[@]}" -c "do \$\$ begin if not exists (select from pg_roles where rolname = 'downdip') then create role downdip login password 'downdip'; end if; end \$\$;" >/dev/null
  if [ -z "$(pg_as_owner "${psql[@]}" -c "select 1 from pg_database where datname = '$db'")" ]; then
    pg_as_owner "${psql[@]}" -c "create database \"$db\" owner downdip" >/dev/null
  fi
}

pg_drop_database() {
  local data="$1" port="$2" db="$3"
  pg_as_owner "$PG_BIN/psql" -h "$data" -p "$port" -U postgres -d postgres -qtA \
    -c "drop database if exists \"$db\" with (force)" >/dev/null
}
