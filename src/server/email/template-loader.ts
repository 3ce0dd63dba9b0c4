// Owns reading e-mail templates and partials from disk and keeping them in memory.
import { readFile, readdir } from "node:fs/promises";
import path from "node:path";
import Mustache from "mustache";
import type { EmailTemplateName } from "./templates";

export interface LoadedTemplate {
  mjml: string;
  text: string;
  mjmlPartials: Record<string, string>;
  textPartials: Record<string, string>;
}

async function readPartials(
  dir: string,
): Promise<Pick<LoadedTemplate, "mjmlPartials" | "textPartials">> {
  const partialsDir = path.join(dir, "partials");
  const mjmlPartials: Record<string, string> = {};
  const textPartials: Record<string, string> = {};
  for (const file of await readdir(partialsDir)) {
    const ext = path.extname(file);
    const target = ext === ".mjml" ? mjmlPartials : ext === ".txt" ? textPartials : null;
    if (target)
      target[path.basename(file, ext)] = await readFile(path.join(partialsDir, file), "utf8");
  }
  return { mjmlPartials, textPartials };
}

async function loadTemplate(dir: string, name: EmailTemplateName): Promise<LoadedTemplate> {
  const [mjml, text, partials] = await Promise.all([
    readFile(path.join(dir, `${name}.mjml`), "utf8"),
    readFile(path.join(dir, `${name}.txt`), "utf8"),
    readPartials(dir),
  ]);
  // Parsing now surfaces Mustache syntax errors at load and fills Mustache's token cache.
  Mustache.parse(mjml);
  Mustache.parse(text);
  return { mjml, text, ...partials };
}

// Templates are read once per directory and name; a failed load is not cached.
const templateCache = new Map<string, Promise<LoadedTemplate>>();

export function getTemplate(dir: string, name: EmailTemplateName): Promise<LoadedTemplate> {
  const key = `${dir}\u0000${name}`;
  let loaded = templateCache.get(key);
  if (!loaded) {
    loaded = loadTemplate(dir, name);
    templateCache.set(key, loaded);
    loaded.catch(() => templateCache.delete(key));
  }
  return loaded;
}

/** Forget loaded templates (after editing them while the process runs). */
export function clearEmailTemplateCache(): void {
  templateCache.clear();
}

// An unknown partial would silently render as nothing; fail instead.
export function lookupPartial(partials: Record<string, string>, name: EmailTemplateName) {
  return (partial: string): string => {
    const found = partials[partial];
    if (found === undefined)
      throw new Error(`E-mail template "${name}" uses unknown partial "${partial}"`);
    return found;
  };
}
