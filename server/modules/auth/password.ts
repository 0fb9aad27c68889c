import crypto from 'node:crypto';

/** scrypt (RFC 7914; memory-hard) from node:crypto. Stored as scrypt$N$r$p$salt$hash (base64). */
const KEYLEN = 64;

function scrypt(password: string, salt: Buffer, N: number, r: number, p: number): Promise<Buffer> {
  return new Promise((resolve, reject) =>
    crypto.scrypt(password, salt, KEYLEN, { N, r, p, maxmem: 256 * N * r + 1024 * 1024 }, (err, key) => (err ? reject(err) : resolve(key))),
  );
}

/** cost 2^15 × r 8 = 32 MiB per hash; tests use a lighter cost (the cost travels with each hash) */
export async function hashPassword(password: string, cost = process.env.NODE_ENV === 'test' ? 2 ** 12 : 2 ** 15): Promise<string> {
  const salt = crypto.randomBytes(16);
  const key = await scrypt(password, salt, cost, 8, 1);
  return ['scrypt', cost, 8, 1, salt.toString('base64'), key.toString('base64')].join('$');
}

export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const [alg, N, r, p, salt, hash] = stored.split('$');
  if (alg !== 'scrypt' || !hash) return false;
  const expected = Buffer.from(hash, 'base64');
  const key = await scrypt(password, Buffer.from(salt, 'base64'), Number(N), Number(r), Number(p));
  return key.length === expected.length && crypto.timingSafeEqual(key, expected);
}

/** a random URL-safe token and the sha256 hash that is stored instead of it */
export function newToken(): { token: string; hash: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}
export function hashToken(token: string): string {
  return crypto.createHash('sha256').update(token).digest('hex');
}
