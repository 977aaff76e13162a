import { hash, parseOptions, verify } from '@node-rs/argon2';

/**
 * argon2id at the OWASP Password Storage Cheat Sheet's first recommended setting (19 MiB, 2 passes,
 * 1 lane). @node-rs/argon2 hashes with argon2id unless told otherwise, so the algorithm is left at
 * its default: its `Algorithm` enum is an ambient const enum that isolatedModules cannot read.
 */
export const passwordHashParameters = { memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

const argon2idVersion = 1; // Version.V0x13, the current argon2 version (0x13 = 19)
const argon2id = 2; // Algorithm.Argon2id

/**
 * NFKC first (NIST SP 800-63B), so the same password typed on two keyboards that encode "é"
 * differently still matches. Never trimmed or truncated.
 */
const normalized = (password: string) => password.normalize('NFKC');

/** A PHC string (`$argon2id$v=19$m=19456,t=2,p=1$salt$hash`) with a random 16-byte salt, or `salt` when given. */
export function hashPassword(password: string, salt?: Uint8Array): Promise<string> {
  return hash(normalized(password), { ...passwordHashParameters, ...(salt ? { salt } : {}) });
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, normalized(password));
  } catch {
    // A malformed stored hash never signs anyone in.
    return false;
  }
}

/** True when a stored hash was made with weaker settings than today's, so the next sign-in re-hashes it. */
export function needsRehash(passwordHash: string): boolean {
  try {
    const used = parseOptions(passwordHash);
    return (
      (used.algorithm as number) !== argon2id ||
      (used.version as number) !== argon2idVersion ||
      used.memoryCost < passwordHashParameters.memoryCost ||
      used.timeCost < passwordHashParameters.timeCost ||
      used.parallelism < passwordHashParameters.parallelism
    );
  } catch {
    return true;
  }
}
