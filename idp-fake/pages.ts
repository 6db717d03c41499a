import { randomBytes } from 'node:crypto';

// Server-rendered pages of the demo IdP in Fluxtrail's look. Every page carries its own
// nonce-based Content-Security-Policy, because oidc-provider adds none to these responses.

export function newNonce(): string {
  return randomBytes(16).toString('base64');
}

export function contentSecurityPolicy(nonce: string): string {
  return [
    "default-src 'none'",
    `style-src 'nonce-${nonce}'`,
    `script-src 'nonce-${nonce}'`,
    "base-uri 'none'",
    "frame-ancestors 'none'",
  ].join('; ');
}

export function escapeHtml(value: string): string {
  return value
    .replaceAll('&', '&amp;')
    .replaceAll('<', '&lt;')
    .replaceAll('>', '&gt;')
    .replaceAll('"', '&quot;')
    .replaceAll("'", '&#39;');
}

const STYLE = `
:root { --graphite: #23272b; --graphite-soft: #3a4046; --paper: #f6f4ef; --copper: #b8733a; --copper-dark: #955a29; --alarm: #9b2c1f; }
* { box-sizing: border-box; }
body { margin: 0; min-height: 100vh; display: grid; place-items: center; background: var(--graphite);
  color: var(--graphite); font: 18px/1.45 "IBM Plex Sans", system-ui, -apple-system, "Segoe UI", Roboto, sans-serif; }
main { width: min(28rem, calc(100vw - 2rem)); background: var(--paper); border-top: 6px solid var(--copper);
  border-radius: 6px; padding: 2rem 2rem 1.5rem; box-shadow: 0 12px 32px rgba(0, 0, 0, 0.35); }
.brand { display: flex; align-items: center; gap: 0.6rem; font-weight: 600; letter-spacing: 0.04em; color: var(--graphite-soft); }
.mark { width: 1.1rem; height: 1.1rem; background: var(--copper); transform: rotate(45deg); border-radius: 2px; }
h1 { font-size: 1.6rem; margin: 0.8rem 0 0.2rem; }
.note { margin: 0 0 1.4rem; color: var(--graphite-soft); font-size: 0.95rem; }
label { display: block; font-weight: 600; margin: 1rem 0 0.35rem; }
input { width: 100%; font: inherit; font-size: 1.15rem; padding: 0.8rem 0.9rem; border: 2px solid #b9b4a9;
  border-radius: 4px; background: #fff; color: var(--graphite); }
input:focus { outline: 3px solid var(--copper); outline-offset: 1px; border-color: var(--copper); }
button { width: 100%; margin-top: 1.6rem; font: inherit; font-size: 1.15rem; font-weight: 600; padding: 0.9rem;
  border: 0; border-radius: 4px; background: var(--copper); color: #fff; cursor: pointer; min-height: 3.2rem; }
button:hover { background: var(--copper-dark); }
button:focus-visible { outline: 3px solid var(--graphite); outline-offset: 2px; }
.error { margin: 0 0 0.5rem; padding: 0.7rem 0.9rem; border-left: 5px solid var(--alarm); background: #f3dcd6;
  color: var(--alarm); font-weight: 600; }
.error::before { content: "\\26A0  "; }
.hint { margin: 1.4rem 0 0; font-size: 0.85rem; color: var(--graphite-soft); }
code { font-family: "IBM Plex Mono", ui-monospace, monospace; }
`;

function layout(title: string, nonce: string, body: string, script = ''): string {
  const scriptTag = script ? `<script nonce="${nonce}">${script}</script>` : '';
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style nonce="${nonce}">${STYLE}</style>
${scriptTag}
</head>
<body>
<main>
<div class="brand"><span class="mark" aria-hidden="true"></span>FLUXTRAIL</div>
${body}
</main>
</body>
</html>`;
}

export interface SignInPageInput {
  uid: string;
  nonce: string;
  login?: string;
  failed?: boolean;
}

export function signInPage({ uid, nonce, login = '', failed = false }: SignInPageInput): string {
  const error = failed ? '<p class="error" role="alert">Wrong login or password.</p>' : '';
  return layout('Fluxtrail sign-in', nonce, `
<h1>Fluxtrail sign-in</h1>
<p class="note">Demo identity provider — local accounts only</p>
${error}
<form method="post" action="/interaction/${encodeURIComponent(uid)}/login">
<label for="login">Login</label>
<input id="login" name="login" value="${escapeHtml(login)}" autocomplete="username" required autocapitalize="none" spellcheck="false" ${login ? '' : 'autofocus'}>
<label for="password">Password</label>
<input id="password" name="password" type="password" autocomplete="current-password" required ${login ? 'autofocus' : ''}>
<button type="submit">Sign in</button>
</form>
<p class="hint">Accounts: <code>operator</code>, <code>quality</code>, <code>quality2</code>, <code>auditor</code>,
<code>manager</code>, <code>admin</code> — password <code>fluxtrail</code>.</p>`);
}

/**
 * The sign-out page: oidc-provider's confirm form, submitted by script at once, with a visible
 * button when scripts are off. The hidden `logout=yes` ends the whole IdP session.
 */
export function signOutPage(providerForm: string, nonce: string): string {
  const form = providerForm.replace('</form>', '<input type="hidden" name="logout" value="yes"/></form>');
  const submit = "document.addEventListener('DOMContentLoaded', function () { document.getElementById('op.logoutForm').submit(); });";
  return layout('Signing out of Fluxtrail', nonce, `
<h1>Signing out…</h1>
<p class="note">Demo identity provider — local accounts only</p>
${form}
<button type="submit" form="op.logoutForm">Sign out</button>`, submit);
}

export function signedOutPage(nonce: string): string {
  return layout('Signed out of Fluxtrail', nonce, `
<h1>Signed out</h1>
<p class="note">You are signed out of the Fluxtrail demo identity provider.</p>`);
}

export function errorPage(title: string, detail: string, nonce: string): string {
  return layout('Fluxtrail sign-in problem', nonce, `
<h1>${escapeHtml(title)}</h1>
<p class="error" role="alert">${escapeHtml(detail)}</p>
<p class="hint">Go back to Fluxtrail and start the sign-in again.</p>`);
}
