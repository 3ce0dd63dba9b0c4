// Signs out through Auth.js (CSRF token first), then returns to the sign-in page.
export async function signOutOfDesk(): Promise<void> {
  const { csrfToken } = (await (await fetch("/api/auth/csrf")).json()) as { csrfToken: string };
  await fetch("/api/auth/signout", {
    method: "POST",
    headers: { "Content-Type": "application/x-www-form-urlencoded", "X-Auth-Return-Redirect": "1" },
    body: new URLSearchParams({ csrfToken, callbackUrl: "/sign-in?signedOut=1" }),
  });
  window.location.href = "/sign-in?signedOut=1";
}
