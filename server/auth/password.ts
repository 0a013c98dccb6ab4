import { hash, verify, type Options } from "@node-rs/argon2";

// argon2id with m = 19 MiB, t = 2, p = 1: the minimum configuration the OWASP Password
// Storage Cheat Sheet recommends for Argon2id (owasp.org, Cheat Sheet Series, "Password Storage").
const passwordHashOptions: Options = {
  algorithm: 2, // Argon2id (a const enum in the package's types, so spelled as its value)
  memoryCost: 19_456,
  timeCost: 2,
  parallelism: 1,
};

export function hashPassword(password: string): Promise<string> {
  return hash(password, passwordHashOptions);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

// Verifying against a throw-away hash when the account does not exist keeps sign-in timing
// the same for known and unknown addresses.
let decoy: Promise<string> | undefined;
export async function verifyDecoy(password: string): Promise<false> {
  decoy ??= hashPassword("decoy password, never valid");
  await verifyPassword(await decoy, password);
  return false;
}
