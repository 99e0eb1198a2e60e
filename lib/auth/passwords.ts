import bcrypt from "bcryptjs";

const COST = 11;



export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

/** A real hash of a random string: compared against when the account is unknown, so timing does not tell. */
const DUMMY_HASH = bcrypt.hashSync("portolan-no-such-account", COST);

export async function checkPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  return ok && !!hash;
}
