// Signs in over plain HTTP (Auth.js CSRF dance) and keeps the cookies, for route-level tests.
export interface HttpSession {
  cookie: string;
  fetch(path: string, init?: RequestInit): Promise<Response>;
}

function mergeCookies(jar: Map<string, string>, res: Response): void {
  for (const line of res.headers.getSetCookie()) {
    const [pair] = line.split(";");
    if (!pair) continue;
    const eq = pair.indexOf("=");
    jar.set(pair.slice(0, eq).trim(), pair.slice(eq + 1));
  }
}

export async function signInOverHttp(baseUrl: string, email: string, password: string): Promise<{ status: number; session: HttpSession; body: unknown }> {
  const jar = new Map<string, string>();
  const cookieHeader = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const csrfRes = await fetch(`${baseUrl}/api/auth/csrf`);
  mergeCookies(jar, csrfRes);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const res = await fetch(`${baseUrl}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: {
      "Content-Type": "application/x-www-form-urlencoded",
      "X-Auth-Return-Redirect": "1",
      Origin: baseUrl,
      Cookie: cookieHeader(),
    },
    body: new URLSearchParams({ email, password, csrfToken, callbackUrl: `${baseUrl}/` }),
  });
  mergeCookies(jar, res);
  const body = await res.json().catch(() => null);
  const session: HttpSession = {
    get cookie() {
      return cookieHeader();
    },
    fetch: (path, init = {}) =>
      fetch(`${baseUrl}${path}`, {
        redirect: "manual",
        ...init,
        headers: { Origin: baseUrl, Cookie: cookieHeader(), ...(init.headers ?? {}) },
      }),
  };
  return { status: res.status, session, body };
}

export function isSignedIn(session: HttpSession): boolean {
  return /authjs\.session-token=/.test(session.cookie);
}
