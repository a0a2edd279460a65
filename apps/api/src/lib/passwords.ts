import { hash, verify } from '@node-rs/argon2';

// argon2id (the library's default algorithm) with the OWASP-recommended minimum of 19 MiB, 2 passes, 1 lane.
const options = { memoryCost: 19456, timeCost: 2, parallelism: 1 };

export function hashPassword(plain: string): Promise<string> {
  return hash(plain, options);
}

export async function verifyPassword(hashed: string, plain: string): Promise<boolean> {
  try {
    return await verify(hashed, plain);
  } catch {
    return false;
  }
}

let dummy: Promise<string> | undefined;
/** Spend the same time as a real check when the account does not exist, so timing reveals nothing. */
export async function verifyAgainstDummy(plain: string): Promise<void> {
  dummy ??= hashPassword('stringfield-timing-equaliser');
  await verifyPassword(await dummy, plain);
}
