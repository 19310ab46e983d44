import "server-only";
import { ZxcvbnFactory } from "@zxcvbn-ts/core";
import * as common from "@zxcvbn-ts/language-common";
import * as en from "@zxcvbn-ts/language-en";

// Length alone lets "111111111111" through. zxcvbn estimates how many guesses an attacker with the
// usual lists (leaked passwords, common words, keyboard walks, repeats, dates) needs; score 3 is
// about 10^8 guesses, the level its authors advise as the minimum for a password on a site.
const MIN_SCORE = 3;
// Shorter parts of a name or address ("al", "jo") occur in too many ordinary words to forbid.
const MIN_PERSONAL_PART = 4;

export const WEAK_PASSWORD =
  "This password is easy to guess: it is common, a pattern or a repeat. Choose a longer one, such as a few unrelated words with spaces between them.";
export const PERSONAL_PASSWORD =
  "This password contains your e-mail address or name, which others know. Choose one without them, such as a few unrelated words with spaces between them.";

let factory: ZxcvbnFactory | null = null;
function zxcvbn(): ZxcvbnFactory {
  // Building the ranked dictionaries takes a moment; do it once per process, on first use.
  factory ??= new ZxcvbnFactory({
    translations: en.translations,
    graphs: common.adjacencyGraphs,
    dictionary: { ...common.dictionary, ...en.dictionary },
  });
  return factory;
}

const letters = (s: string) => s.toLowerCase().replace(/[^\p{L}\p{N}]+/gu, "");

/** The pieces of a person's address and name that a password must not contain, in letters and digits only. */
function personalParts(who: { email: string; name?: string | null }): string[] {
  const email = who.email.trim().toLowerCase();
  const local = email.split("@")[0] ?? "";
  const name = (who.name ?? "").trim();
  const words = [...local.split(/[^\p{L}\p{N}]+/u), ...name.split(/[^\p{L}\p{N}]+/u)];
  return [...new Set([email, local, name, ...words].map(letters))].filter((p) => p.length >= MIN_PERSONAL_PART);
}

/**
 * Why this password may not be used by this person, in words they can act on, or null when it is fine.
 * The minimum length is zod's job in the request schema; this catches the long but guessable ones.
 */
export function passwordProblem(password: string, who: { email: string; name?: string | null }): string | null {
  const parts = personalParts(who);
  const plain = letters(password);
  if (parts.some((p) => plain.includes(p))) return PERSONAL_PASSWORD;
  const result = zxcvbn().check(password, parts);
  return result.score < MIN_SCORE ? WEAK_PASSWORD : null;
}
