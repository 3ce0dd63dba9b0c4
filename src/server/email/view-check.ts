// Owns the checks a template's data must pass before rendering: required values, lists, safe links.
import type { EmailTemplateName } from "./templates";
import { emailTemplates } from "./templates";

function isMissing(value: unknown): boolean {
  return (
    value === undefined || value === null || (typeof value === "string" && value.trim() === "")
  );
}

/**
 * A link in an e-mail must be an absolute http(s) URL: a "javascript:" or relative link would
 * either run script in some clients or point nowhere. Mustache escaping cannot catch that.
 */
function isSafeLink(value: unknown): boolean {
  if (typeof value !== "string") return false;
  try {
    const url = new URL(value);
    return url.protocol === "https:" || url.protocol === "http:";
  } catch {
    return false;
  }
}

/**
 * Mustache renders a missing value as an empty string, which would send an e-mail with a blank
 * link or name; refuse instead, naming every problem at once.
 */
export function assertViewIsComplete(name: EmailTemplateName, view: Record<string, unknown>): void {
  const spec = emailTemplates[name];
  const problems: string[] = [];
  for (const key of spec.required) {
    if (isMissing(view[key])) problems.push(`${key} is required`);
  }
  for (const key of spec.lists) {
    if (!Array.isArray(view[key])) problems.push(`${key} must be a list`);
  }
  for (const [key, value] of Object.entries(view)) {
    if (key.endsWith("Url") && !isMissing(value) && !isSafeLink(value)) {
      problems.push(`${key} must be an absolute http(s) URL`);
    }
  }
  if (problems.length > 0) {
    throw new Error(`E-mail template "${name}" cannot be rendered: ${problems.join("; ")}`);
  }
}
