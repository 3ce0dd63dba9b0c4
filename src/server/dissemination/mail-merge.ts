// Owns render-once mail merge: an e-mail is rendered with placeholder words where per-recipient
// values go, cut once at those words, and each recipient's copy is the pieces joined with their
// values (MJML costs ~30 ms per render; a cut template costs microseconds per copy).
import type { RenderedEmail } from "@/server/email/render";

/** Letters only, so neither Mustache, MJML nor HTML escaping can alter them. */
export const MERGE_FIELDS = {
  name: "FaculaMergeRecipientName",
  subscriber: "FaculaMergeSubscriberName",
  reference: "FaculaMergeAlertReference",
  ackToken: "FaculaMergeAckToken",
  unsubscribeToken: "FaculaMergeUnsubscribeToken",
} as const;

export type MergeField = keyof typeof MERGE_FIELDS;
export type MergeValues = Partial<Record<MergeField, string>>;

const FIELD_BY_WORD = new Map<string, MergeField>(
  Object.entries(MERGE_FIELDS).map(([field, word]) => [word, field as MergeField]),
);
const ANY_WORD = new RegExp(`(${Object.values(MERGE_FIELDS).join("|")})`);
const HTML_ENTITIES: Record<string, string> = {
  "&": "&amp;",
  "<": "&lt;",
  ">": "&gt;",
  '"': "&quot;",
  "'": "&#39;",
};

// The same five characters the renderer encodes (OWASP XSS Prevention Cheat Sheet, rule 1).
function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => HTML_ENTITIES[c] ?? c);
}

// A subject is one header line: no control characters (header injection needs CR or LF).
function flattenLine(value: string): string {
  return value.replace(/[\u0000-\u001f\u007f\u2028\u2029]+/g, " ").trim();
}

/** Text cut at placeholders: even entries are literal text, odd entries name a field. */
type CutPart = { pieces: string[]; encode: (v: string) => string };

export interface MergeTemplate {
  /** Fields the template needs; filling without one of them throws. */
  fields: ReadonlySet<MergeField>;
  fill(values: MergeValues): RenderedEmail;
}

function cut(text: string, encode: (v: string) => string, fields: Set<MergeField>): CutPart {
  const pieces = text.split(ANY_WORD);
  for (let i = 1; i < pieces.length; i += 2)
    fields.add(FIELD_BY_WORD.get(pieces[i] as string) as MergeField);
  return { pieces, encode };
}

function join(part: CutPart, values: MergeValues): string {
  let out = "";
  for (let i = 0; i < part.pieces.length; i++) {
    const piece = part.pieces[i] as string;
    out +=
      i % 2 === 0 ? piece : part.encode(values[FIELD_BY_WORD.get(piece) as MergeField] as string);
  }
  return out;
}

export function compileMerge(template: RenderedEmail): MergeTemplate {
  const fields = new Set<MergeField>();
  const subject = cut(template.subject, flattenLine, fields);
  const html = cut(template.html, escapeHtml, fields);
  const text = cut(template.text, (v) => v, fields);
  return {
    fields,
    fill(values) {
      const missing = [...fields].filter((f) => values[f] === undefined);
      if (missing.length)
        throw new Error(`A merged e-mail would keep placeholders: ${missing.join(", ")} missing`);
      return { subject: join(subject, values), html: join(html, values), text: join(text, values) };
    },
  };
}

/** True when a rendered part still holds a placeholder word (a field nobody filled in). */
export function hasUnfilledField(text: string): boolean {
  return ANY_WORD.test(text);
}

/** One recipient's copy; throws if a placeholder would be left, so nothing goes out half-filled. */
export function fillMerge(template: RenderedEmail, values: MergeValues): RenderedEmail {
  return compileMerge(template).fill(values);
}
