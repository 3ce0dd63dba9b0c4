import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { checkCredentials } from "@/server/auth/sign-in";
import { checkSignInThrottle, THROTTLE } from "@/server/auth/throttle";
import { runWithRequestFacts } from "@/server/http/request-context";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { insertPerson } from "./people-fixture";

const T0 = new Date("2026-05-04T09:30:00Z");
const at = (seconds: number) => new Date(T0.getTime() + seconds * 1000);
const PASSWORD = "coronal-loop-2026";
const WINDOW_S = 15 * 60; // the throttle's window, 15 minutes

beforeAll(async () => {
  await useTestDatabase();
  for (const name of ["alpha", "beta", "gamma", "delta", "epsilon"]) {
    await insertPerson({
      email: `${name}@halden-ridge.example`,
      role: "forecaster",
      password: PASSWORD,
    });
  }
});
afterAll(closeTestDatabase);

const attempt = (email: string, password: string, ip: string, when: Date) =>
  runWithRequestFacts({ ip, requestId: "t" }, () => checkCredentials({ email, password }, when));

describe("sign-in throttling", () => {
  it("uses 5 failures per account and 20 per address within 15 minutes", () => {
    expect(THROTTLE).toEqual({ windowMinutes: 15, perAccount: 5, perAddress: 20 });
  });

  it("refuses the 6th attempt on an account after 5 failures, even with the right password", async () => {
    const email = "alpha@halden-ridge.example";
    for (let i = 0; i < 4; i++)
      expect(await attempt(email, "wrong-pass", "10.1.0.1", at(i))).toBeNull();
    expect(await checkSignInThrottle(email, "10.1.0.1", at(4))).toEqual({ allowed: true });
    expect(await attempt(email, "wrong-pass", "10.1.0.1", at(4))).toBeNull();
    // Oldest failure at T0 leaves the window at T0 + 900 s; asked at T0 + 10 s: 890 s to wait.
    expect(await checkSignInThrottle(email, "10.1.0.9", at(10))).toEqual({
      allowed: false,
      retryAfterSeconds: WINDOW_S - 10,
    });
    expect(await attempt(email, PASSWORD, "10.1.0.1", at(10))).toBeNull();
  });

  it("still lets another account in from another address", async () => {
    expect(await attempt("beta@halden-ridge.example", PASSWORD, "10.1.0.2", at(11))).toMatchObject({
      email: "beta@halden-ridge.example",
    });
  });

  it("opens the account again once the oldest failures leave the window", async () => {
    const email = "alpha@halden-ridge.example";
    expect((await checkSignInThrottle(email, "10.1.0.9", at(WINDOW_S - 1))).allowed).toBe(false);
    expect(await attempt(email, PASSWORD, "10.1.0.1", at(WINDOW_S + 5))).toMatchObject({ email });
  });

  it("clears an account's failures after a successful sign-in", async () => {
    const email = "gamma@halden-ridge.example";
    for (let i = 0; i < 4; i++) await attempt(email, "wrong-pass", "10.2.0.1", at(i));
    expect(await attempt(email, PASSWORD, "10.2.0.1", at(5))).not.toBeNull();
    for (let i = 0; i < 4; i++) await attempt(email, "wrong-pass", "10.2.0.1", at(6 + i));
    expect(await checkSignInThrottle(email, "10.2.0.1", at(11))).toEqual({ allowed: true });
  });

  it("blocks an address after 20 failures across accounts, but not the same accounts elsewhere", async () => {
    const ip = "10.3.0.1";
    for (let i = 0; i < 19; i++)
      await attempt(`stranger${i}@elsewhere.example`, "guess-1", ip, at(i));
    expect(await checkSignInThrottle("delta@halden-ridge.example", ip, at(19))).toEqual({
      allowed: true,
    });
    await attempt("stranger19@elsewhere.example", "guess-1", ip, at(19));
    const blocked = await checkSignInThrottle("delta@halden-ridge.example", ip, at(20));
    expect(blocked).toEqual({ allowed: false, retryAfterSeconds: WINDOW_S - 20 });
    expect(await attempt("delta@halden-ridge.example", PASSWORD, ip, at(20))).toBeNull();
    expect(await attempt("delta@halden-ridge.example", PASSWORD, "10.3.0.2", at(21))).toMatchObject(
      { email: "delta@halden-ridge.example" },
    );
  });
});
