/**
 * Record ids as they arrive in URLs: a positive whole number of at most 15 digits (so it is a safe
 * integer), written plainly (no sign, space, exponent or leading "+"). Anything else is no id.
 */
export function parseId(value: string): number | null {
  if (!/^\d{1,15}$/.test(value)) return null;
  const id = Number(value);
  return Number.isSafeInteger(id) && id > 0 ? id : null;
}
