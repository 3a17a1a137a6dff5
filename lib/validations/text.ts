import { z } from "zod";

/**
 * Free text as the shared schemas accept it: trimmed, capped to its column, and plain. A NUL
 * (U+0000) or another invisible C0 control would be stored and printed silently; a lone surrogate
 * (half of a UTF-16 pair, ill-formed by the Unicode Standard, ch. 3, D91) cannot be written as
 * UTF-8, and the database driver would store U+FFFD in its place. Both are refused with a message
 * on the field instead. Multi-line fields keep tab, line feed and carriage return.
 */

/** The message for a text over its cap, e.g. "At most 2,000 characters". */
export function atMostCharacters(max: number): string {
  return `At most ${max.toLocaleString("en-US")} characters`;
}

export const BROKEN_CHARACTER_MESSAGE =
  "This text has a broken character (a lone surrogate); retype it.";
export const ONE_LINE_MESSAGE = "Keep this on one line.";

const CONTROL_NAMES: Record<number, string> = { 0x00: "NUL", 0x09: "tab" };

/** "Remove the invisible control character (NUL) from this text." */
export function controlCharacterMessage(code: number): string {
  const name = CONTROL_NAMES[code] ?? `U+${code.toString(16).toUpperCase().padStart(4, "0")}`;
  return `Remove the invisible control character (${name}) from this text.`;
}

/** True when a UTF-16 surrogate stands without its other half (String.prototype.isWellFormed, portably). */
export function hasLoneSurrogate(text: string): boolean {
  for (let i = 0; i < text.length; i++) {
    const unit = text.charCodeAt(i);
    if (unit >= 0xd800 && unit <= 0xdbff) {
      const next = text.charCodeAt(i + 1);
      if (next >= 0xdc00 && next <= 0xdfff) i++;
      else return true;
    } else if (unit >= 0xdc00 && unit <= 0xdfff) {
      return true;
    }
  }
  return false;
}

const isControl = (code: number) => code <= 0x1f || code === 0x7f;
const isLineBreak = (code: number) => code === 0x0a || code === 0x0d;

/**
 * Why a text cannot be stored as written, one message per kind of problem (NUL, a broken
 * character, then the first other control or line break); empty when it is plain text.
 */
export function plainTextProblems(text: string, { multiLine }: { multiLine: boolean }): string[] {
  const problems: string[] = [];
  if (text.includes("\u0000")) problems.push(controlCharacterMessage(0));
  if (hasLoneSurrogate(text)) problems.push(BROKEN_CHARACTER_MESSAGE);
  for (let i = 0; i < text.length; i++) {
    const code = text.charCodeAt(i);
    if (code === 0 || !isControl(code)) continue;
    if (multiLine && (code === 0x09 || isLineBreak(code))) continue;
    problems.push(isLineBreak(code) ? ONE_LINE_MESSAGE : controlCharacterMessage(code));
    break;
  }
  return problems;
}

function plainText(max: number, multiLine: boolean) {
  return z
    .string()
    .trim()
    .max(max, atMostCharacters(max))
    .superRefine((text, ctx) => {
      for (const message of plainTextProblems(text, { multiLine })) {
        ctx.addIssue({ code: "custom", message });
      }
    });
}

/** A trimmed, plain text of one line (a title, a name, an e-mail) of at most `max` characters. */
export function singleLineText(max: number) {
  return plainText(max, false);
}

/** A trimmed, plain text that may run over several lines (a brief, a note) of at most `max` characters. */
export function multiLineText(max: number) {
  return plainText(max, true);
}
