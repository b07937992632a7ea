// The background worker: scheduled bath checks (overdue analyses, alert escalation, missing
// additions, owed alert e-mails) through pg-boss on our PostgreSQL. Started by demo.sh with
// `node --conditions=react-server --import tsx docker-free-scripts/worker.ts`; stops on SIGINT/SIGTERM.
import { databaseUrl } from '../db/pool';
import { startWorker } from '../lib/jobs/boss';

async function main() {
  const worker = await startWorker({ connectionString: databaseUrl() });
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
