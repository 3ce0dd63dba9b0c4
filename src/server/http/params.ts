// Route parameter parsing: a malformed id is a 400, never a 500.
import { AppError } from "./errors";

export function parseIdParam(raw: string | undefined, name = "id"): number {
  const id = Number(raw);
  if (!raw || !/^\d{1,10}$/.test(raw) || !Number.isSafeInteger(id) || id <= 0) {
    throw new AppError("BAD_REQUEST", `The ${name} in the address must be a positive whole number.`, { fields: { [name]: "Not a valid id." } });
  }
  return id;
}
