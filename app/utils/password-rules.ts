// Length rules shared by the sign-up form and the server (OWASP: at least 8, allow at least 64).
export const PASSWORD_MIN = 8;
export const PASSWORD_MAX = 128;

/** A password of nothing but spaces (or other white space) is no password. */
export function isBlankPassword(password: string): boolean {
  return password.trim() === "";
}
