/**
 * The Content-Security-Policy every page carries (a `<meta http-equiv>` first in its head;
 * W3C Content Security Policy Level 3). Pages ship no script, so none may run: not a `<script>`
 * a content file might smuggle in, not an inline event handler, not a `javascript:` link. Styles
 * are inline (the page is the whole download), fonts, charts and icons come from the site itself.
 * `frame-ancestors` cannot be set from a `<meta>`; docs/deploy.md shows the header form for hosts.
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'none'",
  "script-src 'none'",
  "style-src 'unsafe-inline'",
  "img-src 'self'",
  "font-src 'self'",
  "base-uri 'none'",
  "form-action 'none'",
].join('; ');
