/** Create the job-queue schema and queues once, before several processes start together. */
import { startMailQueue } from './mail-queue';

async function main() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('prepare-queue: DATABASE_URL is not set');
  const boss = await startMailQueue(url);
  await boss.stop({ graceful: false, wait: true, timeout: 2000 } as never);
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
