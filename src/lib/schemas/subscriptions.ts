// Input schemas for contacts, alert thresholds, CSV import, deliveries and acknowledgements;
// shared by the forms and the endpoints (isomorphic).
import { z } from "zod";
import { FLARE_LEVELS, type FlareLevel } from "@/lib/domain/flare-levels";
import { emailSchema } from "@/lib/schemas/users";
import { pageSchema } from "@/lib/schemas/paging";

export const THRESHOLD_WINDOWS = [24, 48, 72] as const;
export type ThresholdWindow = (typeof THRESHOLD_WINDOWS)[number];

export const thresholdSchema = z.object({
  level: z.enum(FLARE_LEVELS, { error: "Choose C+, M+ or X." }),
  windowHours: z.coerce
    .number({ error: "Choose 24, 48 or 72 hours." })
    .refine((h): h is ThresholdWindow => (THRESHOLD_WINDOWS as readonly number[]).includes(h), {
      error: "Choose 24, 48 or 72 hours.",
    }),
  probabilityPercent: z.coerce
    .number({ error: "Enter a percentage." })
    .int({ error: "Use a whole percentage." })
    .min(1, { error: "Use at least 1 %." })
    .max(100, { error: "Use at most 100 %." }),
});
export type ThresholdInput = z.infer<typeof thresholdSchema>;

const nameSchema = z
  .string()
  .trim()
  .min(2, { error: "Enter the contact's name." })
  .max(120, { error: "Use at most 120 characters." });

export const contactSchema = z.object({
  organisationId: z.coerce
    .number({ error: "Choose an organisation." })
    .int()
    .positive({ error: "Choose an organisation." }),
  name: nameSchema,
  email: emailSchema,
  wantsBulletins: z.boolean(),
});
export type ContactInput = z.infer<typeof contactSchema>;

export const contactUpdateSchema = contactSchema
  .partial()
  .extend({ isSubscribed: z.boolean().optional() })
  .refine((v) => Object.values(v).some((x) => x !== undefined), { error: "Nothing to change." });
export type ContactUpdateInput = z.infer<typeof contactUpdateSchema>;

export const contactListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  organisationId: z.coerce.number().int().positive().optional(),
  page: pageSchema,
});

/** Limits of one CSV import: enough for an operator's roster, small enough for one transaction. */
export const CONTACT_IMPORT_MAX_BYTES = 512 * 1024;
export const CONTACT_IMPORT_MAX_ROWS = 2000;

export const contactImportSchema = z.object({
  csv: z
    .string({ error: "Choose a CSV file." })
    .min(1, { error: "The file is empty." })
    .refine((s) => new TextEncoder().encode(s).length <= CONTACT_IMPORT_MAX_BYTES, {
      error: `The file is larger than ${CONTACT_IMPORT_MAX_BYTES / 1024} KiB.`,
    }),
  mode: z.enum(["preview", "commit"], { error: "Say whether to preview or import." }),
});
export type ContactImportInput = z.infer<typeof contactImportSchema>;

export const subscriptionPrefsSchema = z
  .object({ wantsBulletins: z.boolean().optional(), isSubscribed: z.boolean().optional() })
  .refine((v) => v.wantsBulletins !== undefined || v.isSubscribed !== undefined, {
    error: "Nothing to change.",
  });
export type SubscriptionPrefsInput = z.infer<typeof subscriptionPrefsSchema>;

export const retryDeliveriesSchema = z
  .object({
    bulletinId: z.number().int().positive().optional(),
    ids: z.array(z.number().int().positive()).min(1).max(1000).optional(),
  })
  .refine((v) => (v.bulletinId === undefined) !== (v.ids === undefined), {
    error: "Give either a bulletin or a list of deliveries.",
  });
export type RetryDeliveriesInput = z.infer<typeof retryDeliveriesSchema>;

export const deliveryQuerySchema = z.object({
  bulletin: z.coerce
    .number({ error: "Give a bulletin id." })
    .int()
    .positive({ error: "Give a bulletin id." })
    .optional(),
});

export const linkTokenSchema = z.object({
  token: z
    .string()
    .min(10, { error: "The link is incomplete." })
    .max(2000, { error: "The link is too long." }),
});

export const deskAckSchema = z.object({
  note: z
    .string()
    .trim()
    .min(3, { error: "Say how the contact acknowledged (e.g. by phone)." })
    .max(300),
});
export type DeskAckInput = z.infer<typeof deskAckSchema>;

export const ALERT_STATES = ["open", "reminded", "escalated", "acknowledged", "expired"] as const;
export type AlertState = (typeof ALERT_STATES)[number];

export const alertListQuerySchema = z.object({
  bulletin: z.coerce.number().int().positive().optional(),
  state: z.enum(ALERT_STATES, { error: "Unknown state." }).optional(),
});

/** "M+ within 24 h at 40 % or more" — the words used on screens and in e-mails. */
export function describeThreshold(
  level: FlareLevel | string,
  windowHours: number,
  probability: number,
): string {
  return `${level} within ${windowHours} h at ${Math.round(probability * 100)} % or more`;
}
