import "server-only";
import { createHash, randomBytes, timingSafeEqual } from "node:crypto";
import { hash, verify } from "@node-rs/argon2";

/** argon2id with the library's defaults (m = 19456 KiB, t = 2, p = 1). */
export function hashPassword(password: string): Promise<string> {
  return hash(password);
}

// Verifying against this when the e-mail is unknown keeps both answers equally slow.
let dummyHash: Promise<string> | null = null;

export async function verifyPassword(storedHash: string | null, password: string): Promise<boolean> {
  if (!storedHash) {
    dummyHash ??= hash("lotwarden-timing-equaliser");
    await verify(await dummyHash, password).catch(() => false);
    return false;
  }
  return verify(storedHash, password).catch(() => false);
}

/** A random URL-safe token (invitations, resets: 32 bytes). Only its sha256 is stored. */
export function newToken(bytes = 32): string {
  return randomBytes(bytes).toString("base64url");
}

export function sha256(value: string): string {
  return createHash("sha256").update(value).digest("hex");
}

export function sameHash(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}
