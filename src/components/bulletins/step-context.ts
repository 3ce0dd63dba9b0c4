// What every step control of the bulletin page shares: one request at a time, its field errors,
// and a schema check before sending (the endpoint validates with the same schema).
import type { ZodType } from "zod";

export interface StepContext {
  id: number;
  revision: number;
  isPending: boolean;
  fieldErrors: Record<string, string>;
  /** Sends one request; on success the page reloads with the bulletin's new state. */
  go: (call: () => Promise<{ id: number }>) => void;
  /** Runs `then` only if `value` passes `schema`, else shows its first message under `key`. */
  check: (schema: ZodType, value: unknown, key: string, then: () => void) => void;
}
