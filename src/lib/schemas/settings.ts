// Office settings: one schema for the admin form, the endpoint and the stored value.
import { z } from "zod";

export const officeSettingsSchema = z.object({
  officeName: z.string().trim().min(2, { error: "Enter the office's name." }).max(120),
  contactLine: z.string().trim().min(5, { error: "Enter a contact line for bulletins." }).max(300),
  isPublicBulletinsAllowed: z.boolean(),
  guidanceMarginPoints: z.coerce
    .number({ error: "Enter a number of percentage points." })
    .min(1, { error: "Use at least 1 point." })
    .max(50, { error: "Use at most 50 points." }),
  alertReminderMinutes: z.coerce
    .number({ error: "Enter minutes." })
    .int({ error: "Use whole minutes." })
    .min(5, { error: "Use at least 5 minutes." })
    .max(24 * 60, { error: "Use at most a day." }),
});
export type OfficeSettings = z.infer<typeof officeSettingsSchema>;

export const DEFAULT_OFFICE_SETTINGS: OfficeSettings = {
  officeName: "Facula forecast office",
  contactLine: "Duty desk: set a contact line in office settings.",
  isPublicBulletinsAllowed: false,
  guidanceMarginPoints: 10,
  alertReminderMinutes: 30,
};
