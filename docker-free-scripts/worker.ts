// The background worker: scheduled bath checks (overdue analyses, alert escalation, missing
// additions, owed alert e-mails), invoice reminders and bake-window alerts through pg-boss on our
// PostgreSQL. Started by demo.sh with
// `node --conditions=react-server --import tsx docker-free-scripts/worker.ts`; stops on SIGINT/SIGTERM.
// Settings from the environment (all optional): DATABASE_URL and the WORKER_* variables listed in
// lib/jobs/settings.ts.
import { databaseUrl } from '../db/pool';
import { startWorker } from '../lib/jobs/boss';
import { JOBS } from '../lib/jobs/registry';
import { workerSettingsFromEnv } from '../lib/jobs/settings';

// pg-boss records a finished run without awaiting it; with the database gone that write rejects
// unheard, which would end the process. The run stays "active" and is retried after its expiry.
process.on('unhandledRejection', (reason) => {
  console.error('[worker] unhandled rejection (kept running):', reason instanceof Error ? reason.message : reason);
});

async function main() {
  const { queues, ...settings } = workerSettingsFromEnv(process.env, JOBS.map((j) => j.name));
  const jobs = queues ? JOBS.filter((j) => queues.includes(j.name)) : JOBS;
  const worker = await startWorker({ connectionString: databaseUrl(), jobs, ...settings });
  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[worker] ${signal}: stopping`);
    await worker.stop().catch((err) => console.error('[worker] stop failed:', err));
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((err) => {
  console.error('[worker] could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
