import { CONTACT_IMPORT_MAX_BYTES, contactImportSchema } from "@/lib/schemas/subscriptions";
import { guardApi } from "@/server/auth/guards";
import { importContacts } from "@/server/dissemination/contact-import.service";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";

// The JSON envelope around the CSV text may escape quotes and line breaks: allow for that.
const BODY_LIMIT = CONTACT_IMPORT_MAX_BYTES * 2 + 1024;

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageContacts");
  const input = await readJsonWith(ctx.request, contactImportSchema, BODY_LIMIT);
  const outcome = await importContacts(input.csv, input.mode, actor);
  if (outcome.committed) return json(outcome, 201);
  if (input.mode === "commit") {
    const message = "Nothing was imported: fix the rows marked below and try again.";
    return json(
      { error: { code: "UNPROCESSABLE_CONTENT", message }, preview: outcome.preview },
      422,
    );
  }
  return json(outcome);
});
