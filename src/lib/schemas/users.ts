// Input schemas for sign-in, invitations and user changes; shared by forms and endpoints.
import { z } from "zod";
import { ROLES } from "@/lib/auth/roles";

export const PASSWORD_RULES = [
  "At least 12 characters",
  "At most 72 bytes (the hashing limit)",
  "At least one letter and one digit or symbol",
] as const;

export const passwordSchema = z
  .string({ error: "Enter a password." })
  .min(12, { error: "Use at least 12 characters." })
  .refine((s) => new TextEncoder().encode(s).length <= 72, {
    error: "Use at most 72 bytes (about 72 plain characters).",
  })
  .refine((s) => /\p{L}/u.test(s) && /[^\p{L}]/u.test(s), {
    error: "Mix at least one letter with one digit or symbol.",
  });

export const emailSchema = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .min(1, { error: "Enter an e-mail address." })
  .max(254, { error: "That address is too long." })
  .pipe(z.email({ error: "Enter a valid e-mail address, like name@example.org." }));

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, { error: "Enter your password." }).max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const roleSchema = z.enum(ROLES, { error: "Choose one of the roles." });

export const inviteSchema = z
  .object({
    email: emailSchema,
    name: z.string().trim().min(2, { error: "Enter the person's name." }).max(120),
    role: roleSchema,
    organisationId: z.coerce.number().int().positive().nullable().optional(),
  })
  .refine((v) => v.role !== "subscriber" || !!v.organisationId, {
    error: "A subscriber belongs to an organisation: choose one.",
    path: ["organisationId"],
  });
export type InviteInput = z.infer<typeof inviteSchema>;

export const acceptInvitationSchema = z
  .object({
    token: z.string().min(10, { error: "The link is incomplete." }).max(2000),
    password: passwordSchema,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { error: "The two passwords differ.", path: ["confirm"] });
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;

export const updateUserSchema = z
  .object({
    role: roleSchema.optional(),
    isActive: z.boolean().optional(),
    organisationId: z.number().int().positive().nullable().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { error: "Nothing to change." });
export type UpdateUserInput = z.infer<typeof updateUserSchema>;

export const organisationSchema = z.object({
  name: z.string().trim().min(2, { error: "Enter the organisation's name." }).max(160),
  sector: z.enum(["power-grid", "hf-radio", "gnss", "satellite-ops", "other"], {
    error: "Choose a sector.",
  }),
});
export type OrganisationInput = z.infer<typeof organisationSchema>;
