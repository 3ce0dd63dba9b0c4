// One schema per bulletin input: the islands' forms and the endpoints validate with the same ones.
import { z } from "zod";
import { BULLETIN_STATES } from "@/lib/domain/bulletin-states";
import { forecastDaySchema } from "./assessment";
import { pageSchema } from "./paging";

export const DISCUSSION_MAX_CHARS = 8000;

const revisionSchema = z.coerce
  .number({ error: "Send the revision you last saw." })
  .int({ error: "A revision is a whole number." })
  .min(1, { error: "A revision is a whole number." });

export const createBulletinSchema = z.object({ forecastDay: forecastDaySchema }).strict();
export type CreateBulletinData = z.infer<typeof createBulletinSchema>;

/** Only the discussion is edited here; finals and full-disk adjustments have their own forms. */
export const editBulletinSchema = z
  .object({
    discussion: z
      .string({ error: "Write the discussion as text." })
      .trim()
      .max(DISCUSSION_MAX_CHARS, {
        error: `Keep the discussion under ${DISCUSSION_MAX_CHARS} characters.`,
      }),
    revision: revisionSchema.optional(),
  })
  .strict();
export type EditBulletinData = z.infer<typeof editBulletinSchema>;

export const returnBulletinSchema = z
  .object({
    comment: z
      .string({ error: "Say what needs to change." })
      .trim()
      .min(1, { error: "Say what needs to change." })
      .max(4000, { error: "Keep the comment under 4000 characters." }),
  })
  .strict();
export type ReturnBulletinData = z.infer<typeof returnBulletinSchema>;

export const withdrawBulletinSchema = z
  .object({
    reason: z
      .string({ error: "Give the reason for withdrawing." })
      .trim()
      .min(5, { error: "Give the reason for withdrawing (a sentence)." })
      .max(2000, { error: "Keep the reason under 2000 characters." }),
  })
  .strict();
export type WithdrawBulletinData = z.infer<typeof withdrawBulletinSchema>;

/** What the reviewer saw: approving refuses if the bulletin changed since (409). Both optional. */
export const approveBulletinSchema = z
  .object({
    revision: revisionSchema.optional(),
    contentHash: z
      .string()
      .regex(/^[0-9a-f]{64}$/, { error: "Not a content fingerprint." })
      .optional(),
  })
  .strict();
export type ApproveBulletinData = z.infer<typeof approveBulletinSchema>;

export const bulletinListQuerySchema = z.object({
  status: z
    .enum(BULLETIN_STATES, { error: `Status is one of ${BULLETIN_STATES.join(", ")}.` })
    .optional(),
  day: forecastDaySchema.optional(),
  page: pageSchema,
  pageSize: z.coerce
    .number()
    .int({ error: "Page size is a whole number." })
    .min(5, { error: "At least 5 per page." })
    .max(100, { error: "At most 100 per page." })
    .default(20),
});
export type BulletinListQuery = z.infer<typeof bulletinListQuerySchema>;

export const feedQuerySchema = z
  .object({
    limit: z.coerce
      .number()
      .int({ error: "Limit is a whole number." })
      .min(1, { error: "Limit is at least 1." })
      .max(100, { error: "Limit is at most 100." })
      .default(20),
    before: z.iso
      .datetime({
        offset: true,
        error: "Give before as an ISO 8601 time, e.g. 2031-05-06T00:30:00Z.",
      })
      .optional(),
  })
  .strict();
export type FeedQuery = z.infer<typeof feedQuerySchema>;
