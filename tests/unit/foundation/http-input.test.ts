import { describe, expect, it } from "vitest";
import { z } from "zod";
import { AppError } from "@/server/http/errors";
import { parseWith, readBodyText, readJson, zodFieldErrors } from "@/server/http/body";
import { parseIdParam } from "@/server/http/params";

const jsonRequest = (body: BodyInit, headers: Record<string, string> = {}) =>
  new Request("http://desk.test/api", {
    method: "POST",
    headers: { "Content-Type": "application/json", ...headers },
    body,
    duplex: "half",
  } as RequestInit);

function streamOf(chunks: number, size: number): ReadableStream<Uint8Array> {
  return new ReadableStream({
    start(controller) {
      for (let i = 0; i < chunks; i++) controller.enqueue(new Uint8Array(size).fill(120));
      controller.close();
    },
  });
}

async function codeOf(promise: Promise<unknown>): Promise<string> {
  const err = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  return err instanceof AppError ? err.code : `not an AppError: ${String(err)}`;
}

describe("reading request bodies", () => {
  it("parses a JSON body", async () => {
    expect(await readJson(jsonRequest('{"a":1}'))).toEqual({ a: 1 });
  });

  it("refuses a body that is not JSON, and one sent without the JSON content type", async () => {
    expect(await codeOf(readJson(jsonRequest("{not json")))).toBe("BAD_REQUEST");
    const form = new Request("http://desk.test/api", { method: "POST", body: "a=1" });
    expect(await codeOf(readJson(form))).toBe("BAD_REQUEST");
  });

  it("refuses a declared length above the limit before reading", async () => {
    const request = jsonRequest("{}", { "Content-Length": "2048" });
    expect(await codeOf(readBodyText(request, 1024))).toBe("PAYLOAD_TOO_LARGE");
  });

  it("stops reading a streamed body once it passes the limit, and accepts one at the limit", async () => {
    expect(await codeOf(readBodyText(jsonRequest(streamOf(3, 400)), 1024))).toBe(
      "PAYLOAD_TOO_LARGE",
    );
    expect((await readBodyText(jsonRequest(streamOf(2, 512)), 1024)).length).toBe(1024);
  });
});

describe("field messages", () => {
  const schema = z.object({ email: z.email({ error: "Bad address." }), n: z.number() });

  it("keys the first message of each field by its path, and '_' for the whole object", () => {
    const result = z.object({ a: z.object({ b: z.string() }) }).safeParse({ a: { b: 1 } });
    expect(result.success).toBe(false);
    if (!result.success) expect(Object.keys(zodFieldErrors(result.error.issues))).toEqual(["a.b"]);
    expect(zodFieldErrors([{ path: [], message: "Nothing to change." }])).toEqual({
      _: "Nothing to change.",
    });
  });

  it("throws BAD_REQUEST with fields for invalid input and returns valid input", () => {
    expect(parseWith(schema, { email: "a@b.example", n: 1 })).toEqual({
      email: "a@b.example",
      n: 1,
    });
    try {
      parseWith(schema, { email: "nope", n: 1 });
      expect.unreachable("parseWith accepted an invalid address");
    } catch (err) {
      expect(err).toBeInstanceOf(AppError);
      expect((err as AppError).fields).toEqual({ email: "Bad address." });
    }
  });
});

describe("parseIdParam", () => {
  it("accepts positive whole numbers", () => {
    expect(parseIdParam("1")).toBe(1);
    expect(parseIdParam("4294967295")).toBe(4294967295);
  });

  it.each([undefined, "", "0", "-1", "1.5", "abc", "1e3", "12345678901", " 1"])(
    "answers %j with BAD_REQUEST",
    (raw) => {
      expect(() => parseIdParam(raw)).toThrowError(
        expect.objectContaining({ code: "BAD_REQUEST", fields: { id: "Not a valid id." } }),
      );
    },
  );
});
