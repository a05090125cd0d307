/** A signed-in client as the benchmarks drive it: the cookies to send back and the CSRF token for writes. */
export interface SignedInClient {
  cookie: string;
  csrf: string;
}

/** Every cookie an answer sets, as name → value (what a browser's cookie jar would keep). */
function keepCookies(jar: Map<string, string>, response: Response): void {
  for (const line of response.headers.getSetCookie()) {
    const pair = line.split(";")[0]!;
    const at = pair.indexOf("=");
    jar.set(pair.slice(0, at), pair.slice(at + 1));
  }
}

const cookieHeader = (jar: Map<string, string>) => [...jar].map(([name, value]) => `${name}=${value}`).join("; ");

/** Signs in over HTTP as the client does: asks who it is (a CSRF cookie and token), then signs in. */
export async function signInOverHttp(appUrl: string, email: string, password: string): Promise<SignedInClient> {
  const jar = new Map<string, string>();
  const me = await fetch(`${appUrl}/api/auth/me`);
  keepCookies(jar, me);
  const { csrfToken } = (await me.json()) as { csrfToken: string };
  const signed = await fetch(`${appUrl}/api/auth/sign-in`, {
    method: "POST",
    headers: { cookie: cookieHeader(jar), "content-type": "application/json", "x-csrf-token": csrfToken },
    body: JSON.stringify({ email, password }),
  });
  if (!signed.ok) throw new Error(`sign-in failed: ${signed.status} ${await signed.clone().text()}`);
  keepCookies(jar, signed);
  return { cookie: cookieHeader(jar), csrf: ((await signed.json()) as { csrfToken: string }).csrfToken };
}
