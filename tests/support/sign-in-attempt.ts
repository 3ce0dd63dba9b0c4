// One credentials sign-in over HTTP that hands back the raw answer (status, headers, cookies),
// for checks on throttling and cookie attributes that the session helper does not expose.
export async function attemptSignIn(
  baseUrl: string,
  email: string,
  password: string,
): Promise<Response> {
  const csrf = await fetch(`${baseUrl}/api/auth/csrf`);
  const cookie = csrf.headers
    .getSetCookie()
    .map((line) => line.split(";")[0])
    .join("; ");
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  return fetch(`${baseUrl}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: {
      "Content-Type": "application/x-www-form-urlencoded",
      "X-Auth-Return-Redirect": "1",
      Origin: baseUrl,
      Cookie: cookie,
    },
    body: new URLSearchParams({ email, password, csrfToken, callbackUrl: `${baseUrl}/` }),
  });
}

/** The Set-Cookie line of one cookie, attributes included. */
export function setCookieLine(response: Response, name: string): string | undefined {
  return response.headers.getSetCookie().find((line) => line.startsWith(`${name}=`));
}
