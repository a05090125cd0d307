const HERE = "http://kerf.invalid";

/**
 * Where to go after signing in: a path inside Kerf, as given in `?next=`; anything else (another
 * site, `//host`, `/\host`, a `javascript:` address, a relative path) goes to `home` instead. The
 * address is read the way a browser reads it (WHATWG URL), so tabs, backslashes and encodings can't
 * smuggle another origin past the check.
 */
export function inAppPath(next: string | null | undefined, home = "/"): string {
  if (!next?.startsWith("/")) return home;
  let url: URL;
  try {
    url = new URL(next, HERE);
  } catch {
    return home;
  }
  return url.origin === HERE ? `${url.pathname}${url.search}${url.hash}` : home;
}
