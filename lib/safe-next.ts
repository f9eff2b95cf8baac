/**
 * Where to go after sign-in: the `next` path when it stays on this site, else the home page.
 *
 * Browsers read `\` as `/` and drop tabs and newlines inside URLs, so `/\evil.example` and
 * `/<tab>/evil.example` both mean `//evil.example` — another site. Those are refused outright, also
 * when percent-encoded (a layer that decodes once more would turn `/%2F%2Fevil` into `//evil`);
 * anything else must resolve to this origin, and the path handed back must not itself begin with
 * `//` (as `/.//evil.example` resolves to).
 */
export function safeNextPath(next: string | null | undefined, origin: string): string {
  const home = "/";
  if (!next || looksOffSite(next)) return home;
  const decoded = decodings(next);
  if (decoded === null || decoded.some(opensOffSite)) return home;
  let target: URL;
  let base: URL;
  try {
    base = new URL(origin);
    target = new URL(next, base);
  } catch {
    return home;
  }
  if (target.origin !== base.origin) return home;
  const path = target.pathname + target.search + target.hash;
  return looksOffSite(path) ? home : path;
}

const CONTROL = /[\u0000-\u001f\u007f]/g;

function looksOffSite(path: string): boolean {
  return !path.startsWith("/") || opensOffSite(path) || /[\\\u0000-\u001f\u007f]/.test(path);
}

/** `//host` or `/\host`, also with control characters between (browsers drop them). */
function opensOffSite(path: string): boolean {
  return /^[/\\]{2}/.test(path.replace(CONTROL, ""));
}

/** The value and what it becomes when percent-decoded again (a few rounds); null if malformed. */
function decodings(value: string): string[] | null {
  const forms = [value];
  for (let round = 0; round < 3; round++) {
    let decoded: string;
    try {
      decoded = decodeURIComponent(forms[forms.length - 1]);
    } catch {
      return null;
    }
    if (decoded === forms[forms.length - 1]) break;
    forms.push(decoded);
  }
  return forms;
}
