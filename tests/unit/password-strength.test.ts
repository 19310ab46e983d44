import { describe, expect, it } from "vitest";
import { passwordProblem } from "@/lib/auth/password-strength";

describe("passwordProblem", () => {
  it.each(["correct horse battery", "tin kettle under moss", "two admins at one site"])(
    "the test password %s passes",
    (p) => expect(passwordProblem(p, { email: "someone@tests.example", name: "Some One" })).toBeNull(),
  );

  it.each([
    "111111111111",
    "aaaaaaaaaaaa",
    "123456789012",
    "password1234",
    "qwertyuiopas",
    "abcdefghijkl",
    "iloveyou1234",
    "Password123!",
  ])("%s is refused as easy to guess", (p) =>
    expect(passwordProblem(p, { email: "someone@tests.example", name: "Some One" })).toMatch(/easy to guess/),
  );

  it("a password containing the e-mail address, its name part or the person's name is refused", () => {
    const who = { email: "Quentin.Mallory@tests.example", name: "Quentin Mallory" };
    for (const p of [
      "quentin.mallory@tests.example",
      "xx quentin.mallory xx",
      "QuentinMallory-2026",
      "mallory quentin stone",
    ]) {
      expect(passwordProblem(p, who), p).toMatch(/e-mail address or name/);
    }
  });

  it("a short name part does not forbid passwords that merely contain those letters", () => {
    expect(passwordProblem("correct horse battery", { email: "al@tests.example", name: "Al Or" })).toBeNull();
  });
});
