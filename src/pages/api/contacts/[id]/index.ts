import { contactUpdateSchema } from "@/lib/schemas/subscriptions";
import { guardApi } from "@/server/auth/guards";
import { findContactItem } from "@/server/dissemination/contacts.db";
import { deleteContact, updateContact } from "@/server/dissemination/contacts.service";
import { readJsonWith } from "@/server/http/body";
import { AppError } from "@/server/http/errors";
import { json, noContent, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "manageContacts");
  const contact = await findContactItem(parseIdParam(ctx.params.id));
  if (!contact) throw new AppError("NOT_FOUND", "No such contact.");
  return json(contact);
});

export const PATCH = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageContacts");
  const id = parseIdParam(ctx.params.id);
  return json(await updateContact(id, await readJsonWith(ctx.request, contactUpdateSchema), actor));
});

export const DELETE = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageContacts");
  await deleteContact(parseIdParam(ctx.params.id), actor);
  return noContent();
});
