// Password length rules (app/utils/password-rules.ts): at least 8, and allow at least 64.
import { describe, expect, it } from "vitest";
import { isBlankPassword, PASSWORD_MAX, PASSWORD_MIN } from "../../../app/utils/password-rules";

describe("password rules", () => {
  it("at least 8 characters, and at least 64 allowed (NIST SP 800-63B, 2017, §5.1.1.1, from memory)", () => {
    expect(PASSWORD_MIN).toBe(8);
    expect(PASSWORD_MAX).toBeGreaterThanOrEqual(64);
  });
  it("a password of white space only is blank; one with a character is not", () => {
    expect(isBlankPassword("        ")).toBe(true);
    expect(isBlankPassword("\t\n ")).toBe(true);
    expect(isBlankPassword(" a ")).toBe(false);
  });
});
