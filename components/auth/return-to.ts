/*
 * Where to go after signing in: the page a signed-out visitor opened (a shared layer-check link,
 * a case link from an e-mail), carried in the sign-in page's `next` parameter. Only paths on
 * this site are followed, never another host ("//host", "/\host") or a protocol URL.
 */

const AUTH_PAGES = ["/sign-in", "/sign-up", "/forgot-password", "/reset-password"];

/*
 * The address the page was loaded with, read when this module loads: before the first render,
 * the router may rewrite the address to "/" while the layouts are still loading, so a shared
 * link opened signed out would otherwise be lost.
 */
let landing: string | undefined = typeof location !== "undefined" && location.pathname ? location.pathname + location.search : undefined;

/** The address the page was loaded with, once (undefined for Home or when already taken). */
export function takeLandingPath(): string | undefined {
  const path = landing;
  landing = undefined;
  return path && path !== "/" ? path : undefined;
}

/** "/layers" with its query, for the sign-in page's `next`; undefined for Home (nothing to return to). */
export function returnPathOf(pathname: string, params: Record<string, string | string[] | undefined>): string | undefined {
  if (!pathname || pathname === "/") return undefined;
  // Expo Router lists a dynamic segment ("/cases/[id]") among the params too: it is in the path already.
  const segments = new Set(pathname.split("/").filter(Boolean).map(decodeSegment));
  const query = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    const values = Array.isArray(value) ? value : value === undefined ? [] : [value];
    if (values.length === 1 && segments.has(values[0]!)) continue;
    for (const v of values) query.append(key, v);
  }
  const q = query.toString();
  return q ? `${pathname}?${q}` : pathname;
}

function decodeSegment(s: string): string {
  try {
    return decodeURIComponent(s);
  } catch {
    return s;
  }
}

/** The `next` parameter when it is a path on this site and not a sign-in page; else Home. */
export function safeReturnTo(next: unknown): string {
  const value = Array.isArray(next) ? next[0] : next;
  if (typeof value !== "string" || value.length > 2000) return "/";
  if (!value.startsWith("/") || value.startsWith("//") || value.startsWith("/\\")) return "/";
  if (/[\u0000-\u001f]/.test(value)) return "/";
  const path = value.split(/[?#]/)[0]!;
  if (AUTH_PAGES.includes(path)) return "/";
  return value;
}
