import { z } from "zod";
import { isCommonPassword } from "./password.server";
import { isBlankPassword, PASSWORD_MAX, PASSWORD_MIN } from "./password-rules";

/** A new password, checked as at sign-up (length, not blank, not on the common-password list). */
export const NewPassword = z
  .string({ error: `Use at least ${PASSWORD_MIN} characters` })
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters`)
  .max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters`)
  .refine((p) => !isBlankPassword(p), "Use letters, digits or symbols, not only spaces")
  .refine((p) => !isCommonPassword(p), "That password is on a public list of common passwords; pick another (a short sentence works well)");

export const PersonName = z
  .string({ error: "Enter your name" })
  .trim()
  .min(1, "Enter your name")
  .max(120, "Keep your name under 120 characters");
