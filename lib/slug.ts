/**
 * The one shape an anthology's slug has: lowercase letters and digits in words joined by single
 * hyphens, as `slugify` (lib/validations/anthology.ts) makes them and a "-2" suffix keeps them,
 * at most as long as the column holds. Lookups refuse anything else before asking the database,
 * whose case-insensitive, space-padding collation would otherwise match "LOW-TIDE" or "low-tide ".
 */
export const SLUG_PATTERN = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

/** The width of the anthology.slug column (db/schema.ts). */
export const SLUG_MAX_LENGTH = 80;

export function isSlug(value: string): boolean {
  return value.length <= SLUG_MAX_LENGTH && SLUG_PATTERN.test(value);
}
