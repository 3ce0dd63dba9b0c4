// Owns rendering a named e-mail template (Mustache, then MJML) into subject, HTML and plain text.
import path from "node:path";
import mjml2html from "mjml";
import Mustache from "mustache";
import type { EmailTemplateData, EmailTemplateName } from "./templates";
import { emailTemplates, isEmailTemplateName } from "./templates";
import { getTemplate, lookupPartial } from "./template-loader";
import { assertViewIsComplete } from "./view-check";

export { clearEmailTemplateCache } from "./template-loader";

export interface RenderedEmail {
  subject: string;
  html: string;
  text: string;
}

export interface RenderEmailOptions {
  /** Directory holding the templates; defaults to `emails/` under the working directory. */
  templatesDir?: string;
}

const HTML_ENTITIES: Record<string, string> = {
  "&": "&amp;",
  "<": "&lt;",
  ">": "&gt;",
  '"': "&quot;",
  "'": "&#39;",
};

/**
 * Entity-encode the five characters that matter in element content and quoted attributes (OWASP
 * XSS Prevention Cheat Sheet, rule 1). Mustache's default also encodes / ` =, which leaves links
 * such as href="https:&#x2F;&#x2F;…" that are valid but hard to read and to test.
 */
function escapeHtml(value: unknown): string {
  return String(value).replace(/[&<>"']/g, (char) => HTML_ENTITIES[char] ?? char);
}

function keepAsText(value: unknown): string {
  return String(value);
}

// Escaping is passed per call so Mustache's global escape is never changed.
const htmlRendering = { escape: escapeHtml };
const textRendering = { escape: keepAsText };

// Header injection needs CR or LF; other control characters have no place in a subject either.
function flattenSubject(subject: string): string {
  return subject
    .replace(/[\u0000-\u001f\u007f\u2028\u2029]+/g, " ")
    .replace(/ {2,}/g, " ")
    .trim();
}

function tidyText(text: string): string {
  return `${text
    .replace(/[ \t]+\n/g, "\n")
    .replace(/\n{3,}/g, "\n\n")
    .trim()}\n`;
}

async function compileMjml(name: EmailTemplateName, source: string): Promise<string> {
  let result;
  try {
    result = await mjml2html(source, { validationLevel: "strict", keepComments: false, fonts: {} });
  } catch (error) {
    throw new Error(`E-mail template "${name}" is not valid MJML: ${String(error)}`, {
      cause: error,
    });
  }
  if (result.errors.length > 0) {
    const messages = result.errors.map((e) => e.formattedMessage).join("; ");
    throw new Error(`E-mail template "${name}" is not valid MJML: ${messages}`);
  }
  return result.html;
}

export async function renderEmail<N extends EmailTemplateName>(
  name: N,
  data: EmailTemplateData[N],
  options: RenderEmailOptions = {},
): Promise<RenderedEmail> {
  if (!isEmailTemplateName(name)) throw new Error(`Unknown e-mail template "${String(name)}"`);
  const view = data as unknown as Record<string, unknown>;
  assertViewIsComplete(name, view);
  const dir = path.resolve(options.templatesDir ?? path.join(process.cwd(), "emails"));
  const template = await getTemplate(dir, name);

  const subject = flattenSubject(
    Mustache.render(emailTemplates[name].subject, view, {}, textRendering),
  );
  const htmlPartials = lookupPartial(template.mjmlPartials, name);
  const mjmlSource = Mustache.render(template.mjml, view, htmlPartials, htmlRendering);
  const html = await compileMjml(name, mjmlSource);
  const textPartials = lookupPartial(template.textPartials, name);
  const text = tidyText(Mustache.render(template.text, view, textPartials, textRendering));
  return { subject, html, text };
}
