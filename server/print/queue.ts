import "server-only";
/**
 * The print queue (BullMQ on Redis). The web app adds one job per print output; the worker
 * (server/print/worker.ts, its own process) takes them. Jobs carry only the output's id: the row
 * in print_output holds everything else, so any number of workers may share the queue.
 */
import { Queue } from "bullmq";
import IORedis from "ioredis";
import type { PrintOutputKind } from "@/lib/domain";
import { env } from "@/lib/env";

export const PRINT_QUEUE = "print-files";

export interface PrintJobData {
  outputId: number;
}

/** A fresh connection; BullMQ's blocking commands need maxRetriesPerRequest: null. */
export function redisConnection(): IORedis {
  return new IORedis(env().REDIS_URL, { maxRetriesPerRequest: null });
}

const globalForQueue = globalThis as unknown as { quirelinePrintQueue?: Queue<PrintJobData> };

/** The queue, one per process (kept on globalThis so dev reloads do not leak connections). */
export function printQueue(): Queue<PrintJobData> {
  globalForQueue.quirelinePrintQueue ??= new Queue<PrintJobData>(PRINT_QUEUE, {
    connection: redisConnection(),
  });
  return globalForQueue.quirelinePrintQueue;
}

/** The job name of an output: its kind, and the ink for a master ("master teal"). */
export function jobNameFor(kind: PrintOutputKind, ink: string | null): string {
  return ink ? `${kind} ${ink}` : kind;
}

/** The job id of an output (BullMQ ids may not be plain integers nor contain ':'). */
export function jobIdFor(outputId: number): string {
  return `output-${outputId}`;
}

/** Adds the output's job; one attempt: a failed run keeps its message and is produced again by hand. */
export async function enqueueOutput(output: {
  id: number;
  kind: PrintOutputKind;
  ink: string | null;
}): Promise<string> {
  const jobId = jobIdFor(output.id);
  await printQueue().add(
    jobNameFor(output.kind, output.ink),
    { outputId: output.id },
    { jobId, attempts: 1, removeOnComplete: 200, removeOnFail: 500 },
  );
  return jobId;
}
