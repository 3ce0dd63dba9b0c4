// Local stand-in for the Resend API: its shapes, a mailbox, idempotency, failures, a store file.
import { createHash, randomUUID } from "node:crypto";
import { appendFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { createServer } from "node:http";
import path from "node:path";
import { pathToFileURL } from "node:url";

const BODY_LIMIT_BYTES = 1024 * 1024;
const MAX_BATCH = 100;
const TAG_PART = /^[A-Za-z0-9_-]{1,256}$/; // Resend's rule for tag names and values
const ERROR_NAMES = {
  400: "validation_error",
  401: "missing_api_key",
  404: "not_found",
  405: "method_not_allowed",
  409: "invalid_idempotent_request",
  413: "validation_error",
  422: "validation_error",
  429: "rate_limit_exceeded",
};

/** Mulberry32 (T. Ettinger, public domain; from memory): a tiny seeded PRNG so failure rates replay exactly. */
function createRandom(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

class ApiError extends Error {
  constructor(status, message, headers = {}) {
    super(message);
    this.status = status;
    this.headers = headers;
  }
}

function fail(status, message, headers) {
  throw new ApiError(status, message, headers);
}

function checkFailure(spec) {
  const { status, rate = 1, count, seed = 1 } = spec ?? {};
  if (!(status === 0 || (Number.isInteger(status) && status >= 400 && status <= 599)))
    fail(422, "status must be 0 or 400-599");
  if (typeof rate !== "number" || !(rate >= 0 && rate <= 1)) fail(422, "rate must be within 0..1");
  if (count !== undefined && !(Number.isInteger(count) && count >= 0))
    fail(422, "count must be a whole number");
  return status === 0
    ? null
    : { status, rate, remaining: count ?? Infinity, random: createRandom(seed) };
}

function readBody(req) {
  return new Promise((resolve, reject) => {
    const chunks = [];
    let size = 0;
    // Keep reading past the limit so the client receives the 413 instead of a reset connection.
    req.on("data", (chunk) => {
      size += chunk.length;
      if (size <= BODY_LIMIT_BYTES) chunks.push(chunk);
    });
    req.on("end", () =>
      size > BODY_LIMIT_BYTES
        ? reject(new ApiError(413, "Request body exceeds 1 MiB"))
        : resolve(Buffer.concat(chunks).toString("utf8")),
    );
    req.on("error", reject);
  });
}

function parseJson(raw) {
  try {
    return JSON.parse(raw);
  } catch {
    return fail(400, "Body is not valid JSON");
  }
}

function validateEmail(email, index) {
  const where = index === undefined ? "" : `[${index}] `;
  if (!email || typeof email !== "object" || Array.isArray(email))
    fail(422, `${where}email must be an object`);
  const to = typeof email.to === "string" ? [email.to] : email.to;
  if (typeof email.from !== "string" || !email.from) fail(422, `${where}Missing \`from\` field.`);
  if (
    !Array.isArray(to) ||
    to.length === 0 ||
    to.length > 50 ||
    !to.every((t) => typeof t === "string" && t.includes("@"))
  )
    fail(422, `${where}\`to\` must hold 1 to 50 addresses.`);
  if (typeof email.subject !== "string" || !email.subject)
    fail(422, `${where}Missing \`subject\` field.`);
  if (typeof email.html !== "string" && typeof email.text !== "string")
    fail(422, `${where}Either \`html\` or \`text\` must be provided.`);
  const tags = email.tags ?? [];
  if (!Array.isArray(tags) || !tags.every((t) => TAG_PART.test(t?.name) && TAG_PART.test(t?.value)))
    fail(422, `${where}Tags may hold only ASCII letters, digits, _ and -.`);
  return {
    from: email.from,
    to,
    subject: email.subject,
    html: email.html ?? null,
    text: email.text ?? null,
    tags,
  };
}

function requireAuth(req) {
  const match = /^Bearer\s+(\S+)$/.exec(req.headers.authorization ?? "");
  if (!match)
    fail(
      401,
      "Missing API key in the authorization header. Include the header Authorization: Bearer YOUR_API_KEY",
    );
}

function readCount(raw, fallback) {
  const n = Number(raw ?? "");
  return raw !== null && Number.isInteger(n) && n >= 0 ? n : fallback;
}

function send(res, status, body, headers = {}) {
  const payload = body === undefined ? "" : JSON.stringify(body);
  res.writeHead(status, { "Content-Type": "application/json", ...headers });
  res.end(payload);
}

/**
 * @param {{ host?: string, port?: number, storeFile?: string }} [options]
 */
export async function startResendFake({ host = "127.0.0.1", port = 0, storeFile } = {}) {
  /** @type {Array<{ id: string, from: string, to: string[], subject: string, html: string | null, text: string | null, tags: Array<{ name: string, value: string }>, idempotencyKey: string | null, receivedAt: string }>} */
  let stored = [];
  /** @type {Map<string, { hash: string, status: number, body: unknown }>} */
  let idempotent = new Map();
  let failure = null;

  if (storeFile) {
    mkdirSync(path.dirname(storeFile), { recursive: true });
    const lines = existsSync(storeFile)
      ? readFileSync(storeFile, "utf8").split("\n").filter(Boolean)
      : [];
    lines.forEach((line, i) => {
      let record;
      try {
        record = JSON.parse(line);
      } catch (error) {
        if (i === lines.length - 1) return; // a write cut short by a crash
        throw new Error(`${storeFile} line ${i + 1} is not JSON`, { cause: error });
      }
      if (record.kind === "idempotency") idempotent.set(record.key, record.answer);
      else stored.push(record.message);
    });
  }
  const persist = (record) => storeFile && appendFileSync(storeFile, `${JSON.stringify(record)}\n`);
  const clearMessages = () => {
    const deleted = stored.length;
    stored = [];
    idempotent = new Map();
    if (storeFile) writeFileSync(storeFile, "");
    return deleted;
  };
  const newestFirst = () => [...stored].reverse();

  function injectFailure() {
    if (!failure || failure.remaining <= 0 || failure.random() >= failure.rate) return;
    failure.remaining -= 1;
    fail(
      failure.status,
      `Injected failure ${failure.status}`,
      failure.status === 429 ? { "Retry-After": "1" } : {},
    );
  }

  function accept(emails, req, route, raw) {
    const key = req.headers["idempotency-key"];
    const hash = createHash("sha256").update(`${route}\n${raw}`).digest("hex");
    if (key !== undefined) {
      if (key.length < 1 || key.length > 256) fail(400, "Idempotency key must be 1-256 characters");
      const previous = idempotent.get(key);
      if (previous && previous.hash !== hash)
        fail(409, "Same idempotency key used with a different request body");
      if (previous) return previous;
    }
    const receivedAt = new Date().toISOString();
    const messages = emails.map((email) => ({
      id: randomUUID(),
      ...email,
      idempotencyKey: key ?? null,
      receivedAt,
    }));
    messages.forEach((message) => {
      stored.push(message);
      persist({ kind: "message", message });
    });
    const ids = messages.map(({ id }) => ({ id }));
    const answer = { hash, status: 200, body: route === "/emails" ? ids[0] : { data: ids } };
    if (key !== undefined) {
      idempotent.set(key, answer);
      persist({ kind: "idempotency", key, answer });
    }
    return answer;
  }

  async function route(req, url) {
    const { pathname } = url;
    if (pathname === "/emails" || pathname === "/emails/batch") {
      if (req.method !== "POST") fail(405, "Method not allowed");
      requireAuth(req);
      const raw = await readBody(req);
      injectFailure();
      const body = parseJson(raw);
      if (pathname === "/emails") return accept([validateEmail(body)], req, pathname, raw);
      if (!Array.isArray(body) || body.length === 0 || body.length > MAX_BATCH)
        fail(422, `A batch holds 1 to ${MAX_BATCH} emails`);
      return accept(body.map(validateEmail), req, pathname, raw);
    }
    if (pathname === "/_fake/health" && req.method === "GET")
      return { status: 200, body: { ok: true, count: stored.length } };
    if (pathname === "/_fake/failure" && req.method === "POST") {
      failure = checkFailure(parseJson(await readBody(req)));
      return { status: 200, body: { ok: true, failing: failure !== null } };
    }
    if (pathname === "/_fake/messages" && req.method === "DELETE")
      return { status: 200, body: { ok: true, deleted: clearMessages() } };
    if (pathname === "/_fake/messages" && req.method === "GET") {
      const to = url.searchParams.get("to")?.toLowerCase();
      const limit = Math.min(readCount(url.searchParams.get("limit"), 50), 500);
      const offset = readCount(url.searchParams.get("offset"), 0);
      const matching = newestFirst().filter((m) => !to || m.to.some((t) => t.toLowerCase() === to));
      return {
        status: 200,
        body: { total: matching.length, messages: matching.slice(offset, offset + limit) },
      };
    }
    const byId = /^\/_fake\/messages\/([^/]+)$/.exec(pathname);
    if (byId && req.method === "GET") {
      const found = stored.find((m) => m.id === decodeURIComponent(byId[1] ?? ""));
      return found ? { status: 200, body: found } : fail(404, "Email not found");
    }
    return fail(404, "Route not found");
  }

  const server = createServer((req, res) => {
    route(req, new URL(req.url ?? "/", "http://fake.invalid")).then(
      (answer) => send(res, answer.status, answer.body),
      (error) => {
        const status = error instanceof ApiError ? error.status : 500;
        const name =
          ERROR_NAMES[status] ?? (status >= 500 ? "internal_server_error" : "validation_error");
        send(
          res,
          status,
          {
            statusCode: status,
            name,
            message: error instanceof Error ? error.message : String(error),
          },
          error.headers,
        );
      },
    );
  });
  await new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, resolve);
  });
  const address = server.address();
  const boundPort = typeof address === "object" && address ? address.port : port;
  return {
    url: `http://${host}:${boundPort}`,
    port: boundPort,
    close: () =>
      new Promise((resolve) => {
        server.close(() => resolve(undefined));
        server.closeAllConnections();
      }),
    messages: () => newestFirst(),
    reset: () => {
      failure = null;
      clearMessages();
    },
    /** @param {{ status: number, rate?: number, count?: number, seed?: number }} spec */
    setFailure: (spec) => {
      failure = checkFailure(spec);
    },
  };
}

if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) {
  const arg = (name) => {
    const i = process.argv.indexOf(`--${name}`);
    return i > 0 ? process.argv[i + 1] : undefined;
  };
  const fake = await startResendFake({
    host: arg("host"),
    port: Number(arg("port") ?? 3901),
    storeFile: arg("store"),
  });
  console.log(`Resend fake listening on ${fake.url}`);
  const stop = () => fake.close().then(() => process.exit(0));
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}
