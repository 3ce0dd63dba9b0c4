// Walks a bulletin through the API for tests: ready for review, issued; and reads the database's
// refusal of a raw statement.
import { expect } from "vitest";
import type { SQL } from "drizzle-orm";
import { getDb } from "@/db/client";
import type { CurrentUser } from "@/lib/auth/roles";
import { POST as create } from "@/pages/api/bulletins/index";
import { PATCH as edit } from "@/pages/api/bulletins/[id]/index";
import { POST as submit } from "@/pages/api/bulletins/[id]/submit";
import { POST as approve } from "@/pages/api/bulletins/[id]/approve";
import { call } from "./desk-fixture";

/** The database's own message when it refuses a statement (drizzle wraps it as the cause), or null. */
export async function refusalOf(statement: SQL): Promise<string | null> {
  try {
    await getDb().execute(statement);
    return null;
  } catch (err) {
    const messages: string[] = [];
    for (let e: unknown = err; e instanceof Error; e = e.cause) messages.push(e.message);
    return messages.join(" | ");
  }
}

export async function readyForReview(day: string, author: CurrentUser): Promise<number> {
  const created = await call(create, "/api/bulletins", "POST", author, { forecastDay: day });
  expect(created.status).toBe(201);
  const p = { id: String(created.body.id) };
  await call(edit, "/", "PATCH", author, { discussion: `Discussion for ${day}.` }, p);
  expect((await call(submit, "/", "POST", author, undefined, p)).body.status).toBe("in_review");
  return created.body.id as number;
}

export async function issueDay(
  day: string,
  author: CurrentUser,
  approver: CurrentUser,
): Promise<number> {
  const id = await readyForReview(day, author);
  const issued = await call(approve, "/", "POST", approver, undefined, { id: String(id) });
  expect(issued.status).toBe(200);
  return id;
}
