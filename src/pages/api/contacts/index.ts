import { searchParamsObject } from "@/lib/schemas/paging";
import { contactListQuerySchema, contactSchema } from "@/lib/schemas/subscriptions";
import { guardApi } from "@/server/auth/guards";
import { listContacts } from "@/server/dissemination/contacts.db";
import { createContact } from "@/server/dissemination/contacts.service";
import { parseWith, readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";

const PAGE_SIZE = 25;

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "manageContacts");
  const query = parseWith(contactListQuerySchema, searchParamsObject(ctx.url.searchParams));
  const { rows, total } = await listContacts({ ...query, pageSize: PAGE_SIZE });
  return json({ contacts: rows, total, page: query.page, pageSize: PAGE_SIZE });
});

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageContacts");
  return json(await createContact(await readJsonWith(ctx.request, contactSchema), actor), 201);
});
