/**
 * Sign-in is a full-page navigation to the API, which sends the browser to the
 * identity provider and back to `returnTo`. Only same-origin paths are passed,
 * so a crafted link cannot make the return leave the application.
 */
export function signInUrl(returnTo: string): string {
  const sameOrigin = returnTo.startsWith('/') && !/^\/[\/\\]/.test(returnTo);
  const path = sameOrigin ? returnTo : '/';
  return `/auth/login?returnTo=${encodeURIComponent(path)}`;
}

/** The path the person is on now, to come back to after signing in. */
export function currentPath(location: Location): string {
  return `${location.pathname}${location.search}`;
}
