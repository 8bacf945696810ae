/**
 * Where to send a user after sign-in: only a path on this site. It must start with a single
 * `/`, and hold no `//`, no backslash (browsers read it as `/`), no scheme and no control or
 * space characters; anything else answers null and the caller goes home.
 */
export function safeReturnTo(value: unknown): string | null {
  if (typeof value !== 'string' || value.length > 2000) return null;
  if (!value.startsWith('/') || value.includes('//') || value.includes('\\')) return null;
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u0020\u007f]/.test(value)) return null;
  // A path cannot carry a scheme: the URL parser must keep it on our own origin.
  const url = new URL(value, 'http://thalpos.invalid');
  if (url.origin !== 'http://thalpos.invalid') return null;
  return value;
}
