import cluster from 'node:cluster';

/**
 * Several app processes sharing one port (node:cluster). The server keeps no state of its own
 * (sessions, jobs and locks are in MariaDB), so any worker may answer any request. A worker that
 * dies is replaced; SIGTERM/SIGINT stop all of them.
 */
export function runWorkers(count: number): void {
  let stopping = false;
  const fork = () => cluster.fork();
  for (let i = 0; i < count; i++) fork();
  cluster.on('exit', (worker, code) => {
    if (stopping) {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(0);
      return;
    }
    console.error(`App worker ${worker.process.pid} exited (code ${code}); starting another.`);
    fork();
  });
  const stop = () => {
    stopping = true;
    for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill('SIGTERM');
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}
