import { createHash, randomBytes } from "node:crypto";

// 256 random bits, well over the 128 a bearer secret needs (common practice); only the hash is ever stored.
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}
