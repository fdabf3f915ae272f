/**
 * The stand-in identity provider's own pages: plain HTML with inline styles, no
 * scripts or fonts from anywhere else (the tests check that nothing leaves the
 * machine). Deliberately simple: it only has to look unlike a real company's
 * sign-in so nobody mistakes it for one.
 */
import { escapeHtml } from '../api/src/shared/escape-html.ts';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './demo-accounts.ts';

const style = `
  body { font-family: system-ui, sans-serif; background: #eef3f2; color: #17302d; margin: 0; }
  main { max-width: 30rem; margin: 3rem auto; background: #fff; border-radius: 12px; padding: 2rem 2.25rem;
         box-shadow: 0 2px 10px rgba(10, 40, 36, 0.12); }
  h1 { font-size: 1.3rem; margin: 0 0 0.25rem; }
  p.lead { margin: 0 0 1.5rem; color: #44605c; }
  label { display: block; font-weight: 600; margin: 1rem 0 0.3rem; }
  input[type=text], input[type=password] { width: 100%; box-sizing: border-box; padding: 0.6rem; font-size: 1rem;
         border: 1px solid #9db5b1; border-radius: 6px; }
  button { margin-top: 1.5rem; width: 100%; padding: 0.7rem; font-size: 1rem; border: 0; border-radius: 6px;
         background: #1d5c55; color: #fff; cursor: pointer; }
  .error { background: #fde8e4; color: #8a1f0f; padding: 0.6rem 0.8rem; border-radius: 6px; margin-bottom: 1rem; }
  table { width: 100%; border-collapse: collapse; margin-top: 1.75rem; font-size: 0.9rem; }
  th, td { text-align: left; padding: 0.3rem 0.4rem; border-bottom: 1px solid #dde7e5; }
  footer { margin-top: 1.5rem; font-size: 0.8rem; color: #5c7470; }
  code { background: #eef3f2; padding: 0 0.25rem; border-radius: 3px; }
`;

function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)} · Fjordvik demo sign-in</title><style>${style}</style></head>
<body><main>${body}
<footer>Local stand-in identity provider for Plyledger demos and tests. Every account here is invented.</footer>
</main></body></html>`;
}

export function signInPage(options: { action: string; clientName: string; login?: string; error?: string }): string {
  const rows = DEMO_ACCOUNTS.map(
    (a) => `<tr><td><code>${escapeHtml(a.login)}</code></td><td>${escapeHtml(a.name)}</td><td>${escapeHtml(a.roles.join(', ') || 'none')}</td></tr>`,
  ).join('');
  return page(
    'Sign in',
    `<h1>Fjordvik Rotorworks (demo)</h1>
<p class="lead">Sign in to continue to ${escapeHtml(options.clientName)}.</p>
${options.error ? `<p class="error" role="alert">${escapeHtml(options.error)}</p>` : ''}
<form method="post" action="${escapeHtml(options.action)}" autocomplete="off">
  <label for="login">User name</label>
  <input id="login" name="login" type="text" required autofocus value="${escapeHtml(options.login ?? '')}">
  <label for="password">Password</label>
  <input id="password" name="password" type="password" required>
  <button type="submit" id="sign-in">Sign in</button>
</form>
<table aria-label="Demo accounts"><thead><tr><th>User name</th><th>Name</th><th>Roles</th></tr></thead><tbody>${rows}</tbody></table>
<p>Password for every demo account: <code>${escapeHtml(DEMO_PASSWORD)}</code></p>`,
  );
}

/** oidc-provider hands us its logout form; we confirm on the user's behalf (the user already chose to sign out in Plyledger). */
export function signOutPage(form: string): string {
  const confirmed = form.replace('</form>', '<input type="hidden" name="logout" value="yes"></form>');
  return page(
    'Signing out',
    `<h1>Signing you out</h1>
<p class="lead">You are being signed out of the demo identity service.</p>
${confirmed}
<button type="submit" form="op.logoutForm">Continue</button>
<script>document.getElementById('op.logoutForm').submit()</script>`,
  );
}

export function signedOutPage(): string {
  return page('Signed out', '<h1>Signed out</h1><p class="lead">You have been signed out of the demo identity service.</p>');
}

export function errorPage(error: string, description?: string): string {
  return page('Sign-in problem', `<h1>Sign-in problem</h1><p class="error">${escapeHtml(error)}${description ? `: ${escapeHtml(description)}` : ''}</p>`);
}
