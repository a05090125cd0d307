/** What the benchmarks share: the p-th percentile of sorted timings, and a signed-in client of a running Kerf. */
export const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))] ?? 0;

export interface SignedIn {
  cookie: string;
  csrf: string;
}

/** Signs in as a browser does: a first visit for the session cookie and CSRF token, then the sign-in. */
export async function signIn(appUrl: string, person: { email: string; password: string }): Promise<SignedIn> {
  const me = await fetch(`${appUrl}/api/auth/me`);
  const anonymous = (me.headers.get("set-cookie") ?? "").split(";")[0]!;
  const { csrfToken } = (await me.json()) as { csrfToken: string };
  const signed = await fetch(`${appUrl}/api/auth/sign-in`, {
    method: "POST",
    headers: { cookie: anonymous, "content-type": "application/json", "x-csrf-token": csrfToken },
    body: JSON.stringify({ email: person.email, password: person.password }),
  });
  if (!signed.ok) throw new Error(`sign-in failed: ${signed.status} ${await signed.clone().text()}`);
  return { cookie: (signed.headers.get("set-cookie") ?? anonymous).split(";")[0]!, csrf: ((await signed.json()) as { csrfToken: string }).csrfToken };
}
