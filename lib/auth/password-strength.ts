import "server-only";
import { ZxcvbnFactory } from "@zxcvbn-ts/core";
import * as common from "@zxcvbn-ts/language-common";
import * as en from "@zxcvbn-ts/language-en";

// How guessable a new password is, by zxcvbn-ts: its common-password, English dictionary,
// keyboard-pattern and date matchers, plus the person's own name and e-mail as extra words.
// Refused: a score under 3 of 4 (zxcvbn's "safely unguessable" band starts at 3), or a
// password that is mostly the name or the e-mail with a little added.

const MIN_SCORE = 3;

let factory: ZxcvbnFactory | null = null;
function zxcvbn(): ZxcvbnFactory {
  factory ??= new ZxcvbnFactory({ translations: en.translations, graphs: common.adjacencyGraphs, dictionary: { ...common.dictionary, ...en.dictionary } });
  return factory;
}

/** The words of a name and an e-mail address that a password should not be built from. */
function personalWords(who: { email?: string; name?: string }): string[] {
  const local = (who.email ?? "").split("@")[0] ?? "";
  const domain = ((who.email ?? "").split("@")[1] ?? "").split(".")[0] ?? "";
  const words = [local, domain, ...local.split(/[^\p{L}\p{N}]+/u), ...(who.name ?? "").split(/[^\p{L}\p{N}]+/u), (who.name ?? "").replace(/\s+/g, "")];
  return [...new Set(words.map((w) => w.toLowerCase()).filter((w) => w.length >= 3))];
}

/** What is left of a password once every personal word is taken out (letters and digits only). */
function withoutPersonalWords(password: string, words: string[]): string {
  let rest = password.toLowerCase();
  for (const w of [...words].sort((a, b) => b.length - a.length)) rest = rest.split(w).join("");
  return rest.replace(/[^\p{L}\p{N}]+/gu, "");
}

/** A message for the password field, or null when the password is strong enough. */
export function passwordProblem(password: string, who: { email?: string; name?: string } = {}): string | null {
  const words = personalWords(who);
  if (words.length && withoutPersonalWords(password, words).length < 6) {
    return "That password is built from your name or e-mail address. Choose one that has nothing to do with you.";
  }
  const result = zxcvbn().check(password, words);
  if (result.score >= MIN_SCORE) return null;
  const warning = result.feedback.warning ? `${result.feedback.warning.replace(/\.$/, "")}. ` : "";
  return `${warning}That password is too easy to guess. Try a few unrelated words together, like a short phrase only you would think of.`;
}
