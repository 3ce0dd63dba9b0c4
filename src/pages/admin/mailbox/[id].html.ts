import type { APIRoute } from "astro";
import { guardApi } from "@/server/auth/guards";
import { getCaught } from "@/server/delivery/mailbox";
import { AppError, errorResponse } from "@/server/http/errors";

// The HTML part of a caught message, framed by the mailbox page in a sandbox without scripts.
export const GET: APIRoute = async (ctx) => {
  try {
    guardApi(ctx, "readMailbox");
    const id = ctx.params.id ?? "";
    if (!/^[\w-]{1,100}$/.test(id)) throw new AppError("BAD_REQUEST", "Not a message id.");
    const message = await getCaught(id);
    return new Response(message.html ?? "<p>(no HTML part)</p>", {
      headers: {
        "Content-Type": "text/html; charset=utf-8",
        "Content-Security-Policy": "default-src 'none'; style-src 'unsafe-inline'; img-src data:; frame-ancestors 'self'",
        "X-Frame-Options": "SAMEORIGIN",
      },
    });
  } catch (err) {
    return errorResponse(err);
  }
};
