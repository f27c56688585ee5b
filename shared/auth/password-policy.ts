/**
 * Password rules shared by the server (which enforces them) and the client (which explains them).
 * ASVS 5.0 6.2.1: at least 8 characters, 15 recommended. bcrypt reads only the first 72 bytes of a
 * password, so longer ones are refused instead of silently truncated (OWASP Password Storage CS).
 */
export const PASSWORD_MIN_CHARS = 8;
export const PASSWORD_RECOMMENDED_CHARS = 15;
export const PASSWORD_MAX_BYTES = 72;

export function passwordLengthProblem(password: string): string | null {
  const chars = [...password].length;
  if (chars < PASSWORD_MIN_CHARS) return `must be at least ${PASSWORD_MIN_CHARS} characters`;
  if (new TextEncoder().encode(password).length > PASSWORD_MAX_BYTES) {
    return `must be at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} plain letters)`;
  }
  return null;
}
