import bcrypt from "bcryptjs";

/** bcrypt cost factor; 12 is the usual default for interactive sign-in. Tests may lower it with BCRYPT_COST. */
function cost(): number {
  const fromEnv = Number(process.env.BCRYPT_COST);
  return Number.isInteger(fromEnv) && fromEnv >= 4 && fromEnv <= 15 ? fromEnv : 12;
}

export const MIN_PASSWORD_LENGTH = 10;

export async function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, cost());
}

export async function verifyPassword(password: string, hash: string): Promise<boolean> {
  try {
    return await bcrypt.compare(password, hash);
  } catch {
    return false;
  }
}

/** A hash of a random secret, compared against when the account does not exist, so timing does not reveal it. */
let dummyHash: string | undefined;
export async function burnPasswordCheck(password: string): Promise<void> {
  dummyHash ??= await bcrypt.hash("benchwright-no-such-account", cost());
  await bcrypt.compare(password, dummyHash);
}
