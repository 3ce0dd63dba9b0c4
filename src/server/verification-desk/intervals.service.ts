// Computes a report's bootstrap intervals and streams progress as JSON lines, one per finished
// interval, then the result.
import type { IntervalsMessage, IntervalsResult } from "@/lib/query/verification";
import type { ReportQuery } from "@/lib/schemas/verification-report";
import { sharedCases } from "./cases";
import { buildIntervalTasks, type IntervalTask } from "./interval-tasks";
import { loadCases } from "./report.service";

/** Lets the stream flush (and other requests run) between two long synchronous tasks. */
const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

export async function prepareIntervalTasks(q: ReportQuery): Promise<IntervalTask[]> {
  const { cases } = await loadCases(q);
  const shared = q.reference ? sharedCases(cases) : null;
  return buildIntervalTasks(
    {
      p: cases.p,
      o: cases.o,
      shared: shared && shared.o.length > 0 ? shared : null,
      threshold: q.threshold,
    },
    q.resamples,
  );
}

/** Runs the tasks in order, calling onProgress after each; returns every interval. */
export async function runIntervalTasks(
  tasks: readonly IntervalTask[],
  onProgress: (done: number, total: number, label: string) => void,
  isCancelled: () => boolean = () => false,
): Promise<IntervalsResult> {
  const result: IntervalsResult = { intervals: {}, skillDifference: null };
  for (const [i, task] of tasks.entries()) {
    if (isCancelled()) break;
    const interval = task.run();
    if (task.key === "skillDifference") result.skillDifference = interval;
    else result.intervals[task.key] = interval;
    onProgress(i + 1, tasks.length, task.label);
    await yieldToEventLoop();
  }
  return result;
}

export function streamIntervals(q: ReportQuery): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  let isCancelled = false;
  return new ReadableStream<Uint8Array>({
    async start(controller) {
      const send = (m: IntervalsMessage) => {
        if (!isCancelled) controller.enqueue(encoder.encode(`${JSON.stringify(m)}\n`));
      };
      try {
        const tasks = await prepareIntervalTasks(q);
        send({ type: "progress", done: 0, total: tasks.length, label: "Resampling cases" });
        await yieldToEventLoop();
        const result = await runIntervalTasks(
          tasks,
          (done, total, label) => send({ type: "progress", done, total, label }),
          () => isCancelled,
        );
        send({ type: "result", result });
      } catch (err) {
        console.error("[facula] bootstrap intervals failed", err);
        send({ type: "error", message: "The intervals could not be computed." });
      }
      if (!isCancelled) controller.close();
    },
    cancel() {
      isCancelled = true;
    },
  });
}
