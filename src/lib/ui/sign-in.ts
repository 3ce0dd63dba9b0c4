// Credentials sign-in through Auth.js from an island: CSRF token, form POST, and a readable outcome.
export type SignInOutcome =
  | { ok: true }
  | { ok: false; kind: "credentials" | "throttled" | "network"; message: string };

export async function signInToDesk(email: string, password: string): Promise<SignInOutcome> {
  try {
    const { csrfToken } = (await (await fetch("/api/auth/csrf")).json()) as { csrfToken: string };
    const res = await fetch("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "Content-Type": "application/x-www-form-urlencoded", "X-Auth-Return-Redirect": "1" },
      body: new URLSearchParams({ email, password, csrfToken, callbackUrl: "/" }),
    });
    if (res.status === 429) {
      const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
      return { ok: false, kind: "throttled", message: body?.error?.message ?? "Too many failed sign-ins. Try again later." };
    }
    const data = (await res.json().catch(() => ({}))) as { url?: string };
    const error = data.url ? new URL(data.url, window.location.origin).searchParams.get("error") : "unknown";
    if (!res.ok || error) {
      return { ok: false, kind: "credentials", message: "That e-mail address and password do not match an active account." };
    }
    return { ok: true };
  } catch {
    return { ok: false, kind: "network", message: "The desk could not be reached. Check your connection and try again." };
  }
}
