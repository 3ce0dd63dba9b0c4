// Password hashing (bcrypt, cost 10) and the password rules shown to people setting one.
import bcrypt from "bcryptjs";

const COST = 10;
// A valid hash of a random string: comparing against it when an account does not exist keeps
// the response time of "wrong e-mail" the same as "wrong password".
const DUMMY_HASH = "$2b$10$CwTycUXWue0Thq9StjUM0uJ8lC2bq0c5QfVZpJ5VdA0cFQ6aYl5xG";

export async function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  if (!hash) {
    await bcrypt.compare(password, DUMMY_HASH);
    return false;
  }
  return bcrypt.compare(password, hash);
}
