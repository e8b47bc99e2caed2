// A three-node MariaDB Galera cluster on loopback (Debian's mariadb-server + galera-4), for `npm run cluster`.
// The commands, the mysql-user rule and the recovery step come from ../shared/design/stack-notes.md §13.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { InfraError, info, step } from './log.mjs';
import { isRunning, startChild } from './proc.mjs';
import { assertPortFree } from './services.mjs';

const PROVIDER = '/usr/lib/galera/libgalera_smm.so';
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/**
 * One node: SQL port `sqlPort`, group communication on 4600+n, IST on 4700+n, SST on 4800+n (all on
 * 127.0.0.1; `portBase` moves them together). `peers` is the gcomm address list of the whole cluster.
 */
export function galeraNode(n, { baseDir, clusterName, sqlPort, portBase, peers }) {
  const dir = path.join(baseDir, `n${n}`);
  const datadir = path.join(dir, 'data');
  const socket = path.join(dir, 'mariadb.sock');
  const errorLog = path.join(dir, 'error.log');
  const g = portBase + 4600 + n;
  const args = [
    '--no-defaults',
    '--user=mysql',
    `--datadir=${datadir}`,
    `--socket=${socket}`,
    `--pid-file=${path.join(dir, 'mariadb.pid')}`,
    `--log-error=${errorLog}`,
    `--tmpdir=${path.join(dir, 'tmp')}`,
    `--port=${sqlPort}`,
    '--bind-address=127.0.0.1',
    '--skip-name-resolve',
    '--character-set-server=utf8mb4',
    '--collation-server=utf8mb4_unicode_ci',
    '--innodb-buffer-pool-size=32M',
    '--wsrep_on=ON',
    `--wsrep_provider=${PROVIDER}`,
    `--wsrep_cluster_address=gcomm://${peers}`,
    `--wsrep_node_address=127.0.0.1:${g}`,
    `--wsrep_node_name=n${n}`,
    `--wsrep_provider_options=gmcast.listen_addr=tcp://127.0.0.1:${g};ist.recv_addr=127.0.0.1:${portBase + 4700 + n};gcache.size=32M;evs.suspect_timeout=PT2S;evs.inactive_timeout=PT4S;evs.keepalive_period=PT0.5S`,
    '--wsrep_sst_method=rsync',
    `--wsrep_sst_receive_address=127.0.0.1:${portBase + 4800 + n}`,
    '--binlog_format=ROW',
    '--default_storage_engine=InnoDB',
    '--innodb_autoinc_lock_mode=2',
    // Causal reads: a read waits until this node has applied what the cluster committed before it began, so
    // "the last round number" read on one node sees a round just made on another (without it a create read a
    // stale number and failed on the unique key: found by the proof below).
    '--wsrep_sync_wait=1',
    `--wsrep_cluster_name=${clusterName}`,
  ];
  let child = null;

  const sql = (statement) => {
    const r = spawnSync('mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot', '-N', '-B'], {
      input: statement,
      encoding: 'utf8',
    });
    if (r.status !== 0) throw new InfraError(`n${n}: ${r.stderr.trim() || 'SQL failed'}`);
    return r.stdout.trim();
  };
  const status = (name) => {
    try {
      return sql(`SHOW GLOBAL STATUS LIKE '${name}'`).split('\t')[1] ?? '';
    } catch {
      return '';
    }
  };

  return {
    name: `n${n}`,
    sqlPort,
    socket,
    sql,
    status,
    get child() {
      return child;
    },
    /** A fresh data folder, owned by mysql (rsync SST drops to nobody under root: stack-notes §13). */
    init() {
      if (existsSync(path.join(datadir, 'mysql'))) return;
      mkdirSync(path.join(dir, 'tmp'), { recursive: true });
      const r = spawnSync(
        'mariadb-install-db',
        ['--no-defaults', '--user=mysql', `--datadir=${datadir}`, '--auth-root-authentication-method=normal'],
        { encoding: 'utf8' },
      );
      if (r.status !== 0) throw new InfraError(`n${n}: mariadb-install-db failed: ${r.stderr.trim()}`);
      spawnSync('chown', ['-R', 'mysql:mysql', dir]);
    },
    async start({ bootstrap = false, position = null } = {}) {
      await assertPortFree(sqlPort, `Galera node n${n}`, 'CLUSTER_PORT_BASE');
      spawnSync('chown', ['-R', 'mysql:mysql', dir]);
      const extra = [];
      if (bootstrap) extra.push('--wsrep-new-cluster');
      if (position) extra.push(`--wsrep_start_position=${position}`);
      child = startChild(`Galera node n${n}`, '/usr/sbin/mariadbd', [...args, ...extra], {
        stop: async () =>
          void spawnSync('mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-uroot', 'shutdown']),
      });
      return child;
    },
    /** Waits until the node is Synced and part of the primary component. */
    async waitSynced(timeoutMs = 60000) {
      const deadline = Date.now() + timeoutMs;
      while (Date.now() < deadline) {
        if (child && !isRunning(child)) {
          const tail = existsSync(errorLog)
            ? readFileSync(errorLog, 'utf8').trim().split('\n').slice(-6).join('\n')
            : '';
          throw new InfraError(`Galera node n${n} stopped during start-up; see ${errorLog}\n${tail}`);
        }
        if (status('wsrep_local_state_comment') === 'Synced' && status('wsrep_ready') === 'ON') return;
        await sleep(200);
      }
      throw new InfraError(`Galera node n${n} was not Synced within ${timeoutMs / 1000} s; see ${errorLog}`);
    },
    /** Kills the node as a crash would (SIGKILL, no shutdown). */
    async kill() {
      if (!child || !isRunning(child)) return;
      const exited = new Promise((r) => child.once('exit', r));
      child.kill('SIGKILL');
      await exited;
    },
    /**
     * After a crash: `--wsrep-recover` once and read the recovered position, so the node rejoins by IST
     * instead of a full state transfer (stack-notes §13).
     */
    recoverPosition() {
      const before = existsSync(errorLog) ? readFileSync(errorLog, 'utf8').length : 0;
      spawnSync('chown', ['-R', 'mysql:mysql', dir]);
      const r = spawnSync('/usr/sbin/mariadbd', [...args, '--wsrep-recover'], {
        encoding: 'utf8',
        timeout: 60000,
      });
      const log = (existsSync(errorLog) ? readFileSync(errorLog, 'utf8').slice(before) : '') + r.stderr;
      const m = log.match(/Recovered position:\s*([0-9a-f-]+:-?\d+)/);
      if (!m) throw new InfraError(`n${n}: --wsrep-recover gave no position; see ${errorLog}`);
      return m[1];
    },
  };
}

/** Starts the cluster: n1 bootstraps, the others join (first join by state transfer). */
export async function startCluster({ baseDir, clusterName = 'roundbook', portBase = 0, sqlPorts }) {
  const peers = [1, 2, 3].map((n) => `127.0.0.1:${portBase + 4600 + n}`).join(',');
  const nodes = [1, 2, 3].map((n) =>
    galeraNode(n, { baseDir, clusterName, sqlPort: sqlPorts[n - 1], portBase, peers }),
  );
  step('Starting a three-node MariaDB Galera cluster on loopback');
  for (const node of nodes) node.init();
  await nodes[0].start({ bootstrap: true });
  await nodes[0].waitSynced();
  for (const node of nodes.slice(1)) {
    await node.start();
    await node.waitSynced(120000);
  }
  info(
    `Galera cluster ${clusterName}: ${nodes.map((n) => `${n.name} on 127.0.0.1:${n.sqlPort}`).join(', ')}; size ${nodes[0].status('wsrep_cluster_size')}`,
  );
  return nodes;
}
