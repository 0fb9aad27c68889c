import type { CookieOptions } from 'express';

/** The app's two cookies: the signed-in session and the anonymous visitor's CSRF secret. */
export interface AuthCookies {
  /** served over https: cookies are Secure and carry the __Host- prefix */
  https: boolean;
  session: string;
  csrf: string;
  /** the attributes both cookies share (what clearCookie must repeat for the browser to drop them) */
  options: CookieOptions;
}

/**
 * Cookie names and attributes from the public URL. Over https both names take the `__Host-` prefix
 * (RFC 6265bis §4.1.3.2: the browser accepts such a cookie only with Secure, Path=/ and no Domain, so a
 * sibling subdomain or a plain-http page cannot plant or overwrite it); over plain http (a local start)
 * the prefix would make browsers refuse the cookie, so the names stay bare.
 */
export function authCookies(publicUrl: string): AuthCookies {
  const https = publicUrl.startsWith('https:');
  const prefix = https ? '__Host-' : '';
  return {
    https,
    session: `${prefix}grisaille.sid`,
    csrf: `${prefix}grisaille.csrf`,
    options: { httpOnly: true, sameSite: 'lax', secure: https, path: '/' },
  };
}

/** One cookie's value from the Cookie header (no decoding: our values are base64url or signed ids). */
export function readCookie(header: string | undefined, name: string): string | undefined {
  if (!header) return undefined;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return part.slice(eq + 1).trim();
  }
  return undefined;
}
