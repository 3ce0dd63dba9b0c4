// Full-disk adjustments: per cell an adjusted probability and the reason for it.
import { z } from "zod";

const cell = z.string().regex(/^(C\+|M\+|X)\.(24h|48h|72h)$/, { error: "Unknown cell." });

export const fullDiskAdjustmentSchema = z
  .object({
    values: z.record(cell, z.number({ error: "Enter a probability." }).min(0, { error: "At least 0 %." }).max(1, { error: "At most 100 %." })),
    reasons: z.record(cell, z.string().trim().max(500, { error: "Keep a reason under 500 characters." })),
  })
  .superRefine((v, ctx) => {
    for (const key of Object.keys(v.values)) {
      if (!v.reasons[key]?.trim()) ctx.addIssue({ code: "custom", path: ["reasons", key], message: "Give a reason for this adjustment." });
    }
  });
export type FullDiskAdjustment = z.infer<typeof fullDiskAdjustmentSchema>;
