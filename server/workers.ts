import cluster from 'node:cluster';

/**
 * Several app processes sharing one port (node:cluster). The server keeps no state of its own
 * (sessions, jobs and locks are in MariaDB), so any worker may answer any request. A worker that
 * dies once it has served is replaced; one that dies before it listens (a port taken, a database
 * out of reach) would only die again, so the primary then stops and exits with its code, for
 * `npm start` or a service manager to report. SIGTERM/SIGINT stop all of them.
 */
export function runWorkers(count: number): void {
  let stopping = false;
  const listening = new Set<number>();
  const fork = () => cluster.fork();
  const stop = () => {
    stopping = true;
    for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill('SIGTERM');
  };
  for (let i = 0; i < count; i++) fork();
  cluster.on('listening', (worker) => listening.add(worker.id));
  cluster.on('exit', (worker, code) => {
    const served = listening.delete(worker.id);
    if (!stopping && !served) {
      console.error(`App worker ${worker.process.pid} exited (code ${code}) before it listened; stopping.`);
      process.exitCode = code || 1;
      stop();
    }
    if (stopping) {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit();
      return;
    }
    console.error(`App worker ${worker.process.pid} exited (code ${code}); starting another.`);
    fork();
  });
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}
