// Reads the JSON body of a file upload with the file's own size limit and a message saying
// what to do, whichever of the two checks (body, then file text) refuses it.
import type { ZodType } from "zod";
import { parseWith, readJson } from "@/server/http/body";
import { AppError } from "@/server/http/errors";

/** JSON escaping of quotes and line ends makes the body longer than the file; a quarter more is ample. */
const JSON_OVERHEAD = 1.25;

export async function readUploadRequest<T extends Record<string, unknown>>(
  request: Request,
  schema: ZodType<T>,
  limit: { field: keyof T & string; maxBytes: number; message: string },
): Promise<T> {
  const tooLarge = (cause?: unknown) =>
    new AppError("PAYLOAD_TOO_LARGE", limit.message, {
      fields: { [limit.field]: `Larger than ${Math.round(limit.maxBytes / 1024 / 1024)} MiB.` },
      cause,
    });
  let body: unknown;
  try {
    body = await readJson(request, Math.ceil(limit.maxBytes * JSON_OVERHEAD));
  } catch (err) {
    if (err instanceof AppError && err.code === "PAYLOAD_TOO_LARGE") throw tooLarge(err);
    throw err;
  }
  const parsed = parseWith(schema, body);
  const text = parsed[limit.field];
  if (typeof text === "string" && Buffer.byteLength(text, "utf8") > limit.maxBytes)
    throw tooLarge();
  return parsed;
}
