// Where to go after sign-in: only a path on this site. The value is resolved against a stand-in origin the way a
// browser resolves it (so "/\host", "/%09/host", "//host" and "https://host" become other origins) and refused
// unless the origin stays the same; what is kept is the normalised path, query and fragment, never a host.
const STAND_IN_ORIGIN = 'http://stanceline.invalid';

export function safeCallbackPath(raw: string | string[] | null | undefined, fallback = '/'): string {
  const value = Array.isArray(raw) ? raw[0] : raw;
  if (typeof value !== 'string' || value === '' || value.length > 2048) return fallback;
  // A browser drops tabs and newlines anywhere in a URL and leading/trailing spaces and controls; do the same first.
  const cleaned = value.replace(/[\t\n\r]/g, '').replace(/^[\u0000-\u0020]+|[\u0000-\u0020]+$/g, '');
  if (!cleaned.startsWith('/')) return fallback;
  let url: URL;
  try {
    url = new URL(cleaned, STAND_IN_ORIGIN);
  } catch {
    return fallback;
  }
  if (url.origin !== STAND_IN_ORIGIN) return fallback;
  const path = `${url.pathname}${url.search}${url.hash}`;
  // The result is used as a relative URL again: it must not be read as protocol-relative either.
  return path.startsWith('/') && !path.startsWith('//') && !path.startsWith('/\\') ? path : fallback;
}
