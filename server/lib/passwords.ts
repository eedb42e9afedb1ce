// argon2id with the OWASP minimum (m=19 MiB, t=2, p=1); ~17 ms a hash on this kind of machine.
import { hash, verify } from '@node-rs/argon2';

const OPTS = { memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export const hashPassword = (pw: string) => hash(pw, OPTS);

export async function verifyPassword(stored: string | null, pw: string) {
  if (!stored) return false;
  try {
    return await verify(stored, pw);
  } catch {
    return false;
  }
}

// A fixed hash to verify against when the e-mail is unknown, so both failures take the same time.
let decoy: Promise<string> | undefined;
export const decoyHash = () => (decoy ??= hashPassword('toolgate-decoy-password'));
