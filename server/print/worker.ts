/**
 * The print worker: its own process (the launcher runs it with tsx, like the seed), taking jobs
 * from the print queue and making each output with produceOutput. It keeps no state of its own:
 * the job names the print_output row, so several workers may share one queue. Stops cleanly on
 * SIGTERM/SIGINT: the job in hand is finished (or left for another worker), then connections close.
 */
import { Worker } from "bullmq";
import { pool } from "@/db";
import { log } from "@/server/log";
import { produceOutput } from "./produce";
import { PRINT_QUEUE, redisConnection, type PrintJobData } from "./queue";

const concurrency = Number.parseInt(process.env.PRINT_WORKER_CONCURRENCY ?? "", 10) || 1;

const worker = new Worker<PrintJobData>(
  PRINT_QUEUE,
  async (job) => {
    const started = performance.now();
    const result = await produceOutput(job.data.outputId, {
      onProgress: (done, total) => job.updateProgress({ done, total }),
      retake: job.stalledCounter > 0,
    });
    // Ids and the outcome only: never the files, the map or people's names.
    log.info(
      {
        kind: "job",
        job: job.id,
        name: job.name,
        output: job.data.outputId,
        result,
        ms: Math.round(performance.now() - started),
      },
      "print job",
    );
    return result;
  },
  { connection: redisConnection(), concurrency },
);

worker.on("error", (error) => log.error({ kind: "worker", error: error.message }, "print worker"));

let stopping = false;
async function stop(signal: string) {
  if (stopping) return;
  stopping = true;
  log.info({ kind: "worker", stopping: signal }, "print worker stopping");
  await worker.close().catch(() => undefined);
  await pool.end().catch(() => undefined);
  process.exit(0);
}
for (const signal of ["SIGTERM", "SIGINT"] as const) process.on(signal, () => void stop(signal));

await worker.waitUntilReady();
console.log(JSON.stringify({ ready: true, queue: PRINT_QUEUE, concurrency }));
