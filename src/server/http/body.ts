// Reads request bodies with a size limit and turns zod failures into field messages.
import type { ZodType } from "zod";
import { AppError, type FieldErrors } from "./errors";

export const DEFAULT_BODY_LIMIT = 1024 * 1024;

export async function readBodyText(request: Request, limitBytes = DEFAULT_BODY_LIMIT): Promise<string> {
  const declared = Number(request.headers.get("content-length") ?? "NaN");
  if (Number.isFinite(declared) && declared > limitBytes) throw tooLarge(limitBytes);
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limitBytes) {
      await reader.cancel();
      throw tooLarge(limitBytes);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString("utf8");
}

function tooLarge(limitBytes: number): AppError {
  return new AppError(
    "PAYLOAD_TOO_LARGE",
    `The request body is larger than ${Math.round(limitBytes / 1024)} KiB.`,
  );
}

export async function readJson(request: Request, limitBytes = DEFAULT_BODY_LIMIT): Promise<unknown> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.includes("application/json")) {
    throw new AppError("BAD_REQUEST", "Send the body as JSON (Content-Type: application/json).");
  }
  const text = await readBodyText(request, limitBytes);
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("BAD_REQUEST", "The request body is not valid JSON.");
  }
}

export function zodFieldErrors(issues: { path: PropertyKey[]; message: string }[]): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join(".") || "_";
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

export function parseWith<T>(schema: ZodType<T>, input: unknown, message = "Some fields need attention."): T {
  const result = schema.safeParse(input);
  if (!result.success) {
    throw new AppError("BAD_REQUEST", message, { fields: zodFieldErrors(result.error.issues) });
  }
  return result.data;
}

export async function readJsonWith<T>(request: Request, schema: ZodType<T>, limitBytes?: number): Promise<T> {
  return parseWith(schema, await readJson(request, limitBytes));
}
