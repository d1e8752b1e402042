#!/usr/bin/env bash
# A three-node MariaDB Galera cluster on 127.0.0.1, owned by the project, for the scale-out
# proofs (tests/cluster). Installed from Debian when missing, data in .cluster/ (git-ignored).
# Node N: SQL port 332N, group communication 460N, IST 461N, SST (rsync) 462N.
# The nodes run as the mysql user: started as root, the rsync state transfer drops to nobody
# and the joiners fail with "Permission denied".
# Writes .cluster/cluster.env (CLUSTER_PORTS, DB_USER, DB_PASSWORD, DB_NAME) for the tests.
# Usage: scripts/cluster.sh start | stop | status | reset   (reset: stop and delete the data)
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
dir="${HEATCLOCK_CLUSTER_DIR:-$root/.cluster}"
envfile="$dir/cluster.env"
nodes=(1 2 3)
sql_port() { echo $((${CLUSTER_SQL_BASE:-3320} + $1)); }
gcomm_port() { echo $((${CLUSTER_GCOMM_BASE:-4600} + $1)); }
ist_port() { echo $((${CLUSTER_GCOMM_BASE:-4600} + 10 + $1)); }
sst_port() { echo $((${CLUSTER_GCOMM_BASE:-4600} + 20 + $1)); }
dbname="${CLUSTER_DB_NAME:-heatclock_cluster}"
provider=/usr/lib/galera/libgalera_smm.so

log() { echo "[cluster] $*"; }

node_dir() { echo "$dir/n$1"; }
# Short socket paths (the limit is 107 characters): fall back to /tmp for a deep project path.
sock() {
  local s
  s="$(node_dir "$1")/s.sock"
  if [ ${#s} -gt 100 ]; then s="/tmp/heatclock-cl-$(echo "$dir" | md5sum | cut -c1-8)-$1.sock"; fi
  echo "$s"
}

ensure_installed() {
  if { command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ]; } && [ -f "$provider" ] && command -v rsync >/dev/null 2>&1; then return; fi
  if [ "$(id -u)" != 0 ]; then
    echo "Galera needs: sudo apt-get install -y --no-install-recommends mariadb-server galera-4 rsync" >&2
    exit 1
  fi
  log "installing mariadb-server, galera-4 and rsync from Debian's packages (about 30 s)"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >/dev/null
  apt-get install -y -qq --no-install-recommends mariadb-server galera-4 rsync lsof >/dev/null
}

bin() { command -v "$1" 2>/dev/null || echo "/usr/sbin/$1"; }
admin() { local n=$1; shift; mariadb-admin --no-defaults --protocol=socket --socket="$(sock "$n")" -uroot --connect-timeout=2 "$@"; }
client() { local n=$1; shift; mariadb --no-defaults --protocol=socket --socket="$(sock "$n")" -uroot --connect-timeout=2 "$@"; }
alive() { [ -S "$(sock "$1")" ] && admin "$1" ping >/dev/null 2>&1; }
status_of() { client "$1" -N -B -e "SELECT CONCAT(MAX(IF(VARIABLE_NAME='WSREP_LOCAL_STATE_COMMENT',VARIABLE_VALUE,'')),' ',MAX(IF(VARIABLE_NAME='WSREP_CLUSTER_SIZE',VARIABLE_VALUE,''))) FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME IN ('WSREP_LOCAL_STATE_COMMENT','WSREP_CLUSTER_SIZE')" 2>/dev/null || true; }
port_free() { node -e 'const s=require("net").createServer();s.once("error",()=>process.exit(1));s.listen(+process.argv[1],"127.0.0.1",()=>s.close())' "$1"; }

write_cnf() {
  local n=$1 d
  d="$(node_dir "$n")"
  local members="" m
  for m in "${nodes[@]}"; do members="$members${members:+,}127.0.0.1:$(gcomm_port "$m")"; done
  cat >"$d/my.cnf" <<CNF
[mariadbd]
user=mysql
datadir=$d/data
socket=$(sock "$n")
pid-file=$d/mariadbd.pid
log-error=$d/error.log
bind-address=127.0.0.1
port=$(sql_port "$n")
skip-name-resolve
character-set-server=utf8mb4
collation-server=utf8mb4_unicode_ci
max-connections=300
innodb-buffer-pool-size=128M
innodb-log-file-size=48M
innodb-flush-log-at-trx-commit=2
binlog_format=ROW
default_storage_engine=InnoDB
innodb_autoinc_lock_mode=2
wsrep_on=ON
wsrep_provider=$provider
wsrep_cluster_name=heatclock_local
wsrep_cluster_address=gcomm://$members
wsrep_node_name=n$n
wsrep_node_address=127.0.0.1
wsrep_provider_options="gmcast.listen_addr=tcp://127.0.0.1:$(gcomm_port "$n");ist.recv_addr=127.0.0.1:$(ist_port "$n");gcache.size=64M"
wsrep_sst_receive_address=127.0.0.1:$(sst_port "$n")
wsrep_sst_method=rsync
wsrep_slave_threads=2
CNF
}

prepare_node() {
  local n=$1 d
  d="$(node_dir "$n")"
  mkdir -p "$d/data"
  write_cnf "$n"
  # Only the first node needs system tables: the others receive the whole data folder by SST.
  if [ "$n" = 1 ] && [ ! -d "$d/data/mysql" ]; then
    log "initialising n1's data folder"
    "$(bin mariadb-install-db)" --no-defaults --user=mysql --datadir="$d/data" \
      --auth-root-authentication-method=normal --skip-test-db >"$d/install-db.log" 2>&1
  fi
  chown -R mysql:mysql "$d"
  chmod 755 "$dir"
}

start_node() {
  local n=$1 extra=${2:-}
  local p
  for p in "$(sql_port "$n")" "$(gcomm_port "$n")" "$(ist_port "$n")" "$(sst_port "$n")"; do
    port_free "$p" || { echo "port $p (node n$n) is in use" >&2; exit 1; }
  done
  rm -f "$(sock "$n")"
  # shellcheck disable=SC2086
  "$(bin mariadbd)" --defaults-file="$(node_dir "$n")/my.cnf" $extra >/dev/null 2>&1 &
  disown || true
}

# Waits until node n answers, is Synced and sees the whole cluster.
wait_synced() {
  local n=$1 want=$2 limit=${3:-120} s=""
  local end=$((SECONDS + limit))
  while [ $SECONDS -lt $end ]; do
    if alive "$n"; then
      s="$(status_of "$n")"
      [ "$s" = "Synced $want" ] && return 0
    fi
    sleep 0.3
  done
  echo "node n$n not Synced with $want members after ${limit}s (state: ${s:-no answer}); see $(node_dir "$n")/error.log" >&2
  tail -25 "$(node_dir "$n")/error.log" >&2 || true
  return 1
}

# After a full stop, the cluster restarts from the node Galera marked safe (the last to leave).
bootstrap_node() {
  local n
  for n in "${nodes[@]}"; do
    if grep -q '^safe_to_bootstrap: *1' "$(node_dir "$n")/data/grastate.dat" 2>/dev/null; then echo "$n"; return; fi
  done
  local g
  g="$(node_dir 1)/data/grastate.dat"
  # No node marked safe (a crash): this is a local test cluster, so node 1 is made the seed.
  [ -f "$g" ] && sed -i 's/^safe_to_bootstrap: *0/safe_to_bootstrap: 1/' "$g"
  echo 1
}

start() {
  ensure_installed
  local t0=$SECONDS n any=0 first
  mkdir -p "$dir"
  for n in "${nodes[@]}"; do alive "$n" && any=1; done
  # Every port of every node that is not running must be free before anything starts.
  local p
  for n in "${nodes[@]}"; do
    alive "$n" && continue
    for p in "$(sql_port "$n")" "$(gcomm_port "$n")" "$(ist_port "$n")" "$(sst_port "$n")"; do
      port_free "$p" || { echo "port $p (node n$n) is in use: set CLUSTER_SQL_BASE / CLUSTER_GCOMM_BASE to move the cluster" >&2; exit 1; }
    done
  done
  for n in "${nodes[@]}"; do prepare_node "$n"; done
  if [ $any = 0 ]; then
    first="$(bootstrap_node)"
    log "bootstrapping a new cluster from n$first"
    start_node "$first" --wsrep-new-cluster
    wait_synced "$first" 1 60
  fi
  for n in "${nodes[@]}"; do
    if ! alive "$n"; then
      log "starting n$n (joins by state transfer)"
      start_node "$n"
      # One joiner at a time: a donor serves one rsync transfer at a time.
      local end=$((SECONDS + 90))
      until alive "$n" || [ $SECONDS -ge $end ]; do sleep 0.3; done
      local size=0 m
      for m in "${nodes[@]}"; do alive "$m" && size=$((size + 1)); done
      wait_synced "$n" "$size" 90
    fi
  done
  for n in "${nodes[@]}"; do wait_synced "$n" 3 60; done
  if [ ! -f "$dir/app-password" ]; then
    head -c 18 /dev/urandom | base64 | tr -dc 'A-Za-z0-9' >"$dir/app-password"
  fi
  local pw
  pw="$(cat "$dir/app-password")"
  # Accounts and databases replicate to every node (total order DDL).
  client 1 <<SQL
CREATE DATABASE IF NOT EXISTS $dbname CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS 'heatclock'@'127.0.0.1' IDENTIFIED BY '$pw';
ALTER USER 'heatclock'@'127.0.0.1' IDENTIFIED BY '$pw';
GRANT ALL PRIVILEGES ON $dbname.* TO 'heatclock'@'127.0.0.1';
SQL
  cat >"$envfile" <<ENV
CLUSTER_PORTS=$(sql_port 1),$(sql_port 2),$(sql_port 3)
DB_HOST=127.0.0.1
DB_USER=heatclock
DB_PASSWORD=$pw
DB_NAME=$dbname
ENV
  log "3 nodes Synced on 127.0.0.1:$(sql_port 1),$(sql_port 2),$(sql_port 3) in $((SECONDS - t0)) s"
}

# The pid of node n's mariadbd when that process is still there (read from its pid file).
node_pid() {
  local f pid
  f="$(node_dir "$1")/mariadbd.pid"
  [ -f "$f" ] || return 1
  pid="$(cat "$f" 2>/dev/null)"
  [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null && grep -q mariadbd "/proc/$pid/cmdline" 2>/dev/null && echo "$pid"
}

stop() {
  local n i pid
  # Joiners first, node 1 last, so node 1 is the one marked safe to bootstrap from next time.
  for n in 3 2 1; do
    if alive "$n"; then
      admin "$n" shutdown >/dev/null 2>&1 || true
      for i in $(seq 1 150); do alive "$n" || break; sleep 0.2; done
    fi
    # A node that does not answer (still receiving its state transfer, or stuck) is ended by its pid.
    if pid="$(node_pid "$n")"; then
      kill "$pid" 2>/dev/null || true
      for i in $(seq 1 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.2; done
      if kill -0 "$pid" 2>/dev/null; then
        log "n$n did not stop; killing it"
        kill -9 "$pid" 2>/dev/null || true
      fi
    fi
    alive "$n" || log "n$n stopped"
  done
}

case "${1:-start}" in
  start) start ;;
  stop) stop ;;
  reset) stop; rm -rf "$dir"; log "data removed" ;;
  status)
    up=0
    for n in "${nodes[@]}"; do
      if alive "$n"; then echo "n$n :$(sql_port "$n") $(status_of "$n")"; up=$((up + 1)); else echo "n$n :$(sql_port "$n") stopped"; fi
    done
    [ $up -gt 0 ] ;;
  *) echo "usage: $0 start|stop|status|reset" >&2; exit 2 ;;
esac
