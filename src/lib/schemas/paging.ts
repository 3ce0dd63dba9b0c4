// Query-string schemas for lists: page numbers, sizes and filters with clear messages.
import { z } from "zod";
import { ROLES } from "@/lib/auth/roles";

export const pageSchema = z.coerce.number().int({ error: "Page must be a whole number." }).min(1, { error: "Page starts at 1." }).default(1);
export const pageSizeSchema = z.coerce.number().int().min(5).max(200).default(25);

export const userListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  role: z.enum(ROLES, { error: "Unknown role." }).optional(),
  status: z.enum(["active", "inactive", "invited"], { error: "Unknown status." }).optional(),
  page: pageSchema,
  pageSize: pageSizeSchema,
});

const utcDay = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { error: "Use a date like 2026-12-01." }).refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), { error: "Not a real date." });

export const auditQuerySchema = z.object({
  action: z.string().trim().max(60).optional(),
  actor: z.string().trim().max(120).optional(),
  from: utcDay.optional(),
  to: utcDay.optional(),
  page: pageSchema,
  pageSize: pageSizeSchema,
});

export const mailboxQuerySchema = z.object({
  to: z.string().trim().max(254).optional(),
  page: pageSchema,
  pageSize: pageSizeSchema,
});

/** Reads URLSearchParams into a plain object, dropping empty values. */
export function searchParamsObject(params: URLSearchParams): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of params) if (v !== "") out[k] = v;
  return out;
}
