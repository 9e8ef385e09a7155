#!/usr/bin/env bash
# A scratch PostgreSQL cluster for tests that stop and start the database under a running app:
#   pg-scratch.sh up DIR PORT [durable]   create (if needed) and start, with the app role and
#                                  database; `durable` keeps fsync and synchronous commit on
#   pg-scratch.sh stop DIR         stop it (fast shutdown)
#   pg-scratch.sh start DIR PORT   start it again
#   pg-scratch.sh down DIR         stop it and remove DIR
source "$(dirname "$0")/lib.sh"
ensure_postgres
cmd="${1:?usage: pg-scratch.sh up|stop|start|down DIR [PORT]}"
dir="${2:?data folder}"
port="${3:-}"
case "$cmd" in
  up)
    mkdir -p "$(dirname "$dir")" && chmod 755 "$(dirname "$dir")"
    if [ "${4:-}" = durable ]; then pg_cluster_up "$dir" "$port"; else pg_cluster_up "$dir" "$port" throwaway; fi
    pg_ensure_database "$dir" "$port" downdip
    ;;
  start) if [ "${4:-}" = durable ]; then pg_cluster_up "$dir" "$port"; else pg_cluster_up "$dir" "$port" throwaway; fi ;;
  stop) pg_cluster_down "$dir" ;;
  down) pg_cluster_down "$dir"; rm -rf "$dir" ;;
  *) die "usage: pg-scratch.sh up|stop|start|down DIR [PORT]" ;;
esac
