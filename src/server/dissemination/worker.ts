// Owns the background loop of the desk: every tick chases unacknowledged alerts, then delivers
// due messages; while more are due it goes again at once. Started by the start script.
import { getDb } from "@/db/client";
import { releaseOrphanedLeases } from "./delivery-claim.db";
import { runDeliveryPass, type DeliveryPassOptions } from "./delivery-pass";
import { runEscalationPass } from "./escalation";

export interface DeliveryWorkerOptions {
  intervalMs?: number;
  delivery?: DeliveryPassOptions;
  /** Where problems are reported; the console by default. */
  log?: (message: string, error?: unknown) => void;
}

export interface DeliveryWorker {
  stop(): Promise<void>;
}

const DEFAULT_INTERVAL_MS = 2000;

export function startDeliveryWorker(options: DeliveryWorkerOptions = {}): DeliveryWorker {
  const intervalMs = options.intervalMs ?? DEFAULT_INTERVAL_MS;
  const log =
    options.log ??
    ((message: string, error?: unknown) => console.error(`[facula] ${message}`, error ?? ""));
  let isStopped = false;
  let timer: NodeJS.Timeout | null = null;
  let current: Promise<void> = Promise.resolve();

  async function tick(): Promise<void> {
    let hasMore = false;
    try {
      await runEscalationPass(new Date());
    } catch (error) {
      log("alert escalation pass failed", error);
    }
    try {
      const pass = await runDeliveryPass(new Date(), options.delivery);
      hasMore = pass.hasMore;
      if (pass.resumed > 0)
        console.log(`[facula] resumed ${pass.resumed} deliveries left in progress`);
    } catch (error) {
      log("delivery pass failed", error);
    }
    if (!isStopped) timer = setTimeout(schedule, hasMore ? 0 : intervalMs);
  }

  function schedule(): void {
    timer = null;
    current = tick();
  }

  // Deliveries a previous process left half-done resume at once, not after their lease.
  current = releaseOrphanedLeases(getDb())
    .then(
      (n) =>
        void (
          n > 0 &&
          console.log(`[facula] resuming ${n} deliveries left in progress by the previous run`)
        ),
    )
    .catch((error: unknown) => log("could not resume deliveries left in progress", error))
    .then(() => (isStopped ? undefined : schedule()));
  return {
    async stop() {
      isStopped = true;
      if (timer) clearTimeout(timer);
      timer = null;
      // The start-up step may hand over to a first tick: wait until nothing is running.
      for (let running = current; ; running = current) {
        await running;
        if (running === current) break;
      }
    },
  };
}
