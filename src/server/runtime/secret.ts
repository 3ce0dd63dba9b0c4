// AUTH_SECRET from the environment, or generated once into the data directory (mode 600).
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";

export function loadOrCreateAuthSecret(dataDir: string, env: NodeJS.ProcessEnv = process.env): string {
  if (env.AUTH_SECRET) return env.AUTH_SECRET;
  const file = path.join(dataDir, "auth-secret");
  if (fs.existsSync(file)) return fs.readFileSync(file, "utf8").trim();
  const secret = randomBytes(48).toString("base64url");
  fs.writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}
