import { z } from "zod";

/** The message for a text over its cap, e.g. "At most 2,000 characters". */
export function atMostCharacters(max: number): string {
  return `At most ${max.toLocaleString("en-US")} characters`;
}

/** A trimmed text of one line (a title, a name, an e-mail) of at most `max` characters. */
export function singleLineText(max: number) {
  return z.string().trim().max(max, atMostCharacters(max));
}

/** A trimmed text that may run over several lines (a brief, a note) of at most `max` characters. */
export function multiLineText(max: number) {
  return z.string().trim().max(max, atMostCharacters(max));
}
