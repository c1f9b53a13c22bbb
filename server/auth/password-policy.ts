/**
 * Passwords as OWASP ASVS 5.0.0 V6.2 asks: at least 12 characters here (V6.2.1 allows 8 only beside a breached-password
 * check), long ones welcome (V6.2.9: 64 and more), checked against a list of common passwords (V6.2.4: at least the
 * top 3000), and no composition rules (V6.2.5). The list is zxcvbn-ts's common-passwords dictionary.
 */
export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 128;

let common: Promise<Set<string>> | undefined;
/** Loaded on first use: the list is large and most requests never set a password. */
const commonPasswords = () =>
  (common ??= import('@zxcvbn-ts/language-common').then(({ dictionary }) => new Set(dictionary['passwords-common'].map((p) => p.toLowerCase()))));

/** What is wrong with a new password, in words for the person choosing it, or null when it will do. */
export async function passwordProblem(password: string): Promise<string | null> {
  const length = Array.from(password).length;
  if (length < PASSWORD_MIN_LENGTH) return `Use at least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words make a long password that is easy to remember.`;
  if (length > PASSWORD_MAX_LENGTH) return `Use at most ${PASSWORD_MAX_LENGTH} characters.`;
  if ((await commonPasswords()).has(password.toLowerCase())) return 'This is one of the most common passwords, so it would be guessed early. Choose another.';
  return null;
}
