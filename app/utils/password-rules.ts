// Length rules shared by the sign-up form and the server (OWASP: at least 8, allow at least 64).
export const PASSWORD_MIN = 8;
export const PASSWORD_MAX = 128;
