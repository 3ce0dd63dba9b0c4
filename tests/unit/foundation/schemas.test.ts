import { describe, expect, it } from "vitest";
import type { ZodType } from "zod";
import {
  acceptInvitationSchema,
  emailSchema,
  inviteSchema,
  passwordSchema,
  signInSchema,
  updateUserSchema,
} from "@/lib/schemas/users";

/** The messages a schema gives for an input, keyed by path ("" for the value itself). */
function messagesOf(schema: ZodType, input: unknown): Record<string, string[]> {
  const result = schema.safeParse(input);
  if (result.success) return {};
  const out: Record<string, string[]> = {};
  for (const issue of result.error.issues) (out[issue.path.join(".")] ??= []).push(issue.message);
  return out;
}

describe("password rules", () => {
  it("accepts 12 characters mixing letters with a digit or symbol", () => {
    expect(messagesOf(passwordSchema, "sunspots-123")).toEqual({});
    expect(messagesOf(passwordSchema, "correct horse battery")).toEqual({});
  });

  it("refuses 11 characters (the minimum is 12)", () => {
    expect(messagesOf(passwordSchema, "sunspots-12")[""]).toContain("Use at least 12 characters.");
  });

  // bcrypt reads only the first 72 bytes of a password (common practice; from memory of the
  // OpenBSD bcrypt design), so a longer one would silently match its own prefix.
  it("refuses more than 72 bytes, counted in UTF-8 bytes rather than characters", () => {
    const tooLong = "a1".repeat(36) + "b";
    expect(new TextEncoder().encode(tooLong).length).toBe(73);
    expect(messagesOf(passwordSchema, tooLong)[""]).toContain(
      "Use at most 72 bytes (about 72 plain characters).",
    );
    expect(messagesOf(passwordSchema, "a1".repeat(36))).toEqual({});
    const accented = "é".repeat(36) + "1"; // 37 characters, 73 bytes
    expect(messagesOf(passwordSchema, accented)[""]).toContain(
      "Use at most 72 bytes (about 72 plain characters).",
    );
  });

  it("refuses only letters, and only digits", () => {
    const mix = "Mix at least one letter with one digit or symbol.";
    expect(messagesOf(passwordSchema, "onlylettershere")[""]).toContain(mix);
    expect(messagesOf(passwordSchema, "123456789012345")[""]).toContain(mix);
  });
});

describe("e-mail addresses", () => {
  it("trims and accepts a valid address", () => {
    expect(emailSchema.parse("  ines@desk.example ")).toBe("ines@desk.example");
  });

  it.each(["not-an-email", "a@", "@desk.example", "two words@desk.example"])(
    "refuses %j",
    (value) => {
      expect(messagesOf(emailSchema, value)[""]).toContain(
        "Enter a valid e-mail address, like name@example.org.",
      );
    },
  );

  it("refuses an empty address and one over 254 characters", () => {
    expect(messagesOf(emailSchema, "   ")[""]).toContain("Enter an e-mail address.");
    expect(messagesOf(emailSchema, `${"a".repeat(250)}@x.example`)[""]).toContain(
      "That address is too long.",
    );
  });
});

describe("invitations", () => {
  const base = { email: "new@desk.example", name: "New Person" };

  it("refuses a subscriber without an organisation, on the organisation field", () => {
    expect(messagesOf(inviteSchema, { ...base, role: "subscriber" })).toEqual({
      organisationId: ["A subscriber belongs to an organisation: choose one."],
    });
    expect(
      messagesOf(inviteSchema, { ...base, role: "subscriber", organisationId: null }),
    ).toHaveProperty("organisationId");
  });

  it("accepts a subscriber with an organisation and staff without one", () => {
    expect(messagesOf(inviteSchema, { ...base, role: "subscriber", organisationId: 2 })).toEqual(
      {},
    );
    expect(messagesOf(inviteSchema, { ...base, role: "verifier" })).toEqual({});
  });

  it("refuses an unknown role, an invalid address and a one-letter name", () => {
    expect(messagesOf(inviteSchema, { ...base, role: "owner" }).role).toEqual([
      "Choose one of the roles.",
    ]);
    expect(messagesOf(inviteSchema, { ...base, role: "admin", email: "x" }).email).toBeDefined();
    expect(messagesOf(inviteSchema, { ...base, role: "admin", name: "X" }).name).toEqual([
      "Enter the person's name.",
    ]);
  });
});

describe("other inputs", () => {
  it("accepting an invitation needs the same password twice", () => {
    const input = { token: "t".repeat(20), password: "sunspots-123", confirm: "sunspots-123" };
    expect(messagesOf(acceptInvitationSchema, input)).toEqual({});
    expect(messagesOf(acceptInvitationSchema, { ...input, confirm: "sunspots-124" })).toEqual({
      confirm: ["The two passwords differ."],
    });
  });

  it("a user change must change something", () => {
    expect(messagesOf(updateUserSchema, {})).toEqual({ "": ["Nothing to change."] });
    expect(messagesOf(updateUserSchema, { isActive: false })).toEqual({});
  });

  it("sign-in needs an address and a password", () => {
    expect(messagesOf(signInSchema, { email: "a@desk.example", password: "" })).toEqual({
      password: ["Enter your password."],
    });
    expect(messagesOf(signInSchema, { email: "a@desk.example", password: "x" })).toEqual({});
  });
});
