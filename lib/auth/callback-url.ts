/**
 * Where to go after sign-in: `value` resolved against the app's own `origin` the way a browser
 * would (a backslash counts as a slash, tabs and newlines are dropped), and only its path, query
 * and fragment followed. Anything that lands on another origin goes home instead.
 */
export function callbackPath(value: string | null | undefined, origin: string): string {
  if (!value) return '/';
  let target: URL;
  try {
    target = new URL(value, origin);
  } catch {
    return '/';
  }
  if (target.origin !== new URL(origin).origin) return '/';
  // "//host" as a path would be read as another host once it is pushed as a relative address.
  return target.pathname.replace(/^\/{2,}/, '/') + target.search + target.hash;
}
