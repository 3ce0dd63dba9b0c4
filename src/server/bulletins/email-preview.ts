// The bulletin e-mail exactly as recipients get it, for the review screen (rendered by the
// dissemination module, so what is reviewed is what is sent).
import { renderBulletinMail } from "@/server/dissemination/bulletin-mail";
import { readConfig } from "@/server/config";
import type { IssuedBulletin } from "./issued-bulletin";

export interface MailPreview {
  subject: string;
  html: string;
  text: string;
}

export function publicBulletinUrl(id: number): string {
  return `${readConfig().publicBaseUrl}/public/bulletins/${id}`;
}

/** Refusals of the renderer (e.g. a template fault) come back as a message, not a broken page. */
export async function previewBulletinMail(
  bulletin: IssuedBulletin,
): Promise<{ mail: MailPreview | null; error: string | null }> {
  try {
    // Each recipient's copy carries their own unsubscribe token; the preview shows where it goes.
    const unsubscribeUrl = `${readConfig().publicBaseUrl}/unsubscribe?token=personal-link-per-recipient`;
    return {
      mail: await renderBulletinMail(bulletin, {
        bulletinUrl: publicBulletinUrl(bulletin.id),
        unsubscribeUrl,
      }),
      error: null,
    };
  } catch (err) {
    console.error("[facula] bulletin e-mail preview failed", err);
    return { mail: null, error: "The e-mail could not be rendered; the server log says why." };
  }
}
