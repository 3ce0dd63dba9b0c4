// Per-request facts (client address, request id) that deep code such as the Auth.js
// authorize callback needs but cannot receive as arguments.
import { AsyncLocalStorage } from "node:async_hooks";

export interface RequestFacts {
  ip: string;
  requestId: string;
}

const storage = new AsyncLocalStorage<RequestFacts>();

export function runWithRequestFacts<T>(facts: RequestFacts, fn: () => T): T {
  return storage.run(facts, fn);
}

export function currentRequestFacts(): RequestFacts {
  return storage.getStore() ?? { ip: "unknown", requestId: "none" };
}
