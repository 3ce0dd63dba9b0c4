// In-memory PGlite with the real migrations, plus a local e-mail fake, for integration tests.
import { closeDatabase, openDatabase } from "@/db/client";
import { startResendFake } from "../../scripts/resend-fake.mjs";

export interface FakeMail {
  url: string;
  close(): Promise<void>;
  messages(): Array<{ id: string; to: string[] | string; subject: string; html: string; text: string }>;
  reset(): void;
  setFailure(f: { status: number; rate?: number; count?: number; seed?: number }): void;
}

export async function useTestDatabase(): Promise<void> {
  process.env.AUTH_SECRET ||= "test-secret-for-integration-tests-only-0123456789";
  // The two-year demo archive is loaded only by tests that ask for it.
  process.env.FACULA_DEMO_ARCHIVE ??= "off";
  await openDatabase({ location: "memory" });
}

export async function useFakeMail(): Promise<FakeMail> {
  const fake = (await startResendFake({ host: "127.0.0.1", port: 0 })) as FakeMail;
  process.env.RESEND_BASE_URL = fake.url;
  process.env.RESEND_API_KEY = "re_test_key";
  return fake;
}

export async function closeTestDatabase(): Promise<void> {
  await closeDatabase();
}
