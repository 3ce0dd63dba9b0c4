// Reads the process environment once into a typed configuration (server only).
import path from "node:path";

export interface AppConfig {
  dataDir: string;
  host: string;
  port: number;
  publicBaseUrl: string;
  authSecret: string;
  resendApiKey: string;
  resendBaseUrl: string | undefined;
  emailFrom: string;
  isEmailFake: boolean;
}

export function readConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const host = env.HOST || "127.0.0.1";
  const port = Number(env.PORT || 4321);
  const authSecret = env.AUTH_SECRET ?? "";
  return {
    dataDir: path.resolve(env.DATA_DIR || "./data"),
    host,
    port,
    publicBaseUrl: (env.PUBLIC_BASE_URL || `http://${host}:${port}`).replace(/\/$/, ""),
    authSecret,
    resendApiKey: env.RESEND_API_KEY || "re_local_fake_key",
    resendBaseUrl: env.RESEND_BASE_URL || undefined,
    emailFrom: env.EMAIL_FROM || "Facula desk <desk@halden-ridge.example>",
    isEmailFake: env.EMAIL_FAKE !== "off",
  };
}

export function requireAuthSecret(env: NodeJS.ProcessEnv = process.env): string {
  const secret = env.AUTH_SECRET;
  if (!secret || secret.length < 32) {
    throw new Error("AUTH_SECRET is missing or shorter than 32 characters");
  }
  return secret;
}
