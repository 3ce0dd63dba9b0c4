import type { APIRoute } from "astro";
import { guardApi } from "@/server/auth/guards";
import { requireReadableBulletin } from "@/server/bulletins/bulletin-view";
import { previewBulletinMail } from "@/server/bulletins/email-preview";
import { readBulletinContent } from "@/server/bulletins/live-content";
import { AppError, errorResponse } from "@/server/http/errors";
import { parseIdParam } from "@/server/http/params";

// The HTML part of the bulletin e-mail, framed by the bulletin page in a sandbox without scripts.
export const GET: APIRoute = async (ctx) => {
  try {
    const viewer = guardApi(ctx, "readBulletins");
    const row = await requireReadableBulletin(parseIdParam(ctx.params.id), viewer);
    const { bulletin, problems } = await readBulletinContent(row, new Date());
    if (!bulletin) throw new AppError("CONFLICT", `No e-mail yet: ${problems.join(" ")}`);
    const { mail, error } = await previewBulletinMail(bulletin);
    if (!mail) throw new AppError("CONFLICT", error ?? "No e-mail could be rendered.");
    return new Response(mail.html, {
      headers: {
        "Content-Type": "text/html; charset=utf-8",
        "Content-Security-Policy":
          "default-src 'none'; style-src 'unsafe-inline'; img-src data:; frame-ancestors 'self'",
        "X-Frame-Options": "SAMEORIGIN",
        "Cache-Control": "no-store",
      },
    });
  } catch (err) {
    return errorResponse(err);
  }
};
