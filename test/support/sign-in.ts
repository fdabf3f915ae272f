/**
 * Signs a demo account in through the real OpenID Connect flow, as a browser
 * would but without one: API /auth/login -> auth-fake's sign-in form -> consent
 * -> API /auth/callback. Cookies are kept in one jar; the API and auth-fake run
 * on one host (127.0.0.1), where a browser shares cookies across ports too.
 */
import { DEMO_PASSWORD } from '../../auth-fake/demo-accounts.ts';

export class CookieJar {
  private readonly cookies = new Map<string, string>();

  take(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const [pair, ...attributes] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      const expired = attributes.some((a) => /^\s*max-age=0\s*$/i.test(a) || (/^\s*expires=/i.test(a) && Date.parse(a.split('=')[1]) < Date.now()));
      if (expired || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  get(name: string): string | undefined {
    return this.cookies.get(name);
  }

  header(): string {
    return [...this.cookies].map(([n, v]) => `${n}=${v}`).join('; ');
  }
}

export interface SignedIn {
  jar: CookieJar;
  /** Cookie header for supertest's .set('Cookie', ...) */
  cookie: string;
  /** Value for the X-XSRF-TOKEN header. */
  csrf: string;
  /** fetch against the API with the session (and the CSRF header on writes). */
  api: (path: string, init?: RequestInit & { json?: unknown }) => Promise<Response>;
}

async function follow(jar: CookieJar, url: string, init: RequestInit = {}): Promise<{ response: Response; url: string }> {
  let current = url;
  let request: RequestInit = init;
  for (let hop = 0; hop < 20; hop++) {
    const response = await fetch(current, { ...request, redirect: 'manual', headers: { ...(request.headers ?? {}), cookie: jar.header() } });
    jar.take(response);
    const location = response.headers.get('location');
    if (response.status < 300 || response.status >= 400 || !location) return { response, url: current };
    current = new URL(location, current).href;
    request = {};
  }
  throw new Error(`too many redirects from ${url}`);
}

export async function signIn(apiUrl: string, login: string, password = DEMO_PASSWORD): Promise<SignedIn> {
  const jar = new CookieJar();
  const start = await follow(jar, `${apiUrl}/auth/login`);
  const page = await start.response.text();
  const action = page.match(/<form method="post" action="([^"]+)"/)?.[1];
  if (!action) throw new Error(`no sign-in form at ${start.url} (status ${start.response.status}): ${page.slice(0, 300)}`);
  const done = await follow(jar, new URL(action.replace(/&amp;/g, '&'), start.url).href, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ login, password }).toString(),
  });
  const csrf = jar.get('XSRF-TOKEN');
  if (!csrf || !jar.get('plyledger.sid')) throw new Error(`sign-in of ${login} did not end with a session (last page ${done.url}, status ${done.response.status})`);
  const api = (path: string, init: RequestInit & { json?: unknown } = {}) => {
    const { json, ...rest } = init;
    const headers: Record<string, string> = { cookie: jar.header(), ...(rest.headers as Record<string, string>) };
    if (rest.method && !['GET', 'HEAD'].includes(rest.method)) headers['x-xsrf-token'] = jar.get('XSRF-TOKEN') ?? '';
    if (json !== undefined) headers['content-type'] = 'application/json';
    return fetch(`${apiUrl}${path}`, { ...rest, headers, body: json !== undefined ? JSON.stringify(json) : rest.body, redirect: 'manual' });
  };
  return { jar, cookie: jar.header(), csrf: decodeURIComponent(csrf), api };
}

/** The JSON body of a fetch response, loosely typed for assertions. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function readJson(response: Response): Promise<any> {
  return response.json();
}
