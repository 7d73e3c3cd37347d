import { randomBytes, scrypt, timingSafeEqual, type ScryptOptions } from "node:crypto";

// scrypt is memory-hard; the cost parameters travel inside each stored hash so they can be
// raised later without breaking existing passwords.
const KEY_LENGTH = 32;

function scryptAsync(password: string, salt: Buffer, options: ScryptOptions): Promise<Buffer> {
  return new Promise((ok, fail) => scrypt(password, salt, KEY_LENGTH, options, (err, key) => (err ? fail(err) : ok(key))));
}

/** Cost of new hashes: N = 2^logN (memory ≈ 128·N·r bytes). */
export interface HashCost {
  logN: number;
  r: number;
  p: number;
}

export const DEFAULT_HASH_COST: HashCost = { logN: 15, r: 8, p: 1 };

/** Hashes a password as `scrypt$logN$r$p$salt$key` (base64url parts). */
export async function hashPassword(password: string, cost: HashCost = DEFAULT_HASH_COST): Promise<string> {
  const salt = randomBytes(16);
  const key = await scryptAsync(password, salt, { N: 2 ** cost.logN, r: cost.r, p: cost.p, maxmem: 256 * 2 ** cost.logN * cost.r });
  return ["scrypt", cost.logN, cost.r, cost.p, salt.toString("base64url"), key.toString("base64url")].join("$");
}

/** True when `password` matches the stored hash; false for any malformed hash. */
export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const [scheme, logN, r, p, salt, key] = stored.split("$");
  if (scheme !== "scrypt" || !salt || !key) return false;
  const N = 2 ** Number(logN);
  const expected = Buffer.from(key, "base64url");
  const actual = await scryptAsync(password, Buffer.from(salt, "base64url"), { N, r: Number(r), p: Number(p), maxmem: 256 * N * Number(r) });
  return actual.length === expected.length && timingSafeEqual(actual, expected);
}

// A fixed hash checked when the email is unknown, so a wrong email costs as long as a wrong password.
let decoy: Promise<string> | undefined;
export const decoyHash = () => (decoy ??= hashPassword(randomBytes(12).toString("hex")));
