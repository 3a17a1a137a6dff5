/**
 * The possessive of a name, with a typographic apostrophe (U+2019), following the Associated
 * Press Stylebook's "possessives" entry: a proper name ending in s takes only an apostrophe
 * ("Salt Lines’ open call", "Agnes’ book"); any other name takes ’s ("Low Tide Almanac’s").
 * Chicago (17th ed., 7.16) would write "Salt Lines’s"; Quireline follows AP so a title ending in
 * s does not read as a typo.
 */
export function possessive(name: string): string {
  const trimmed = name.trimEnd();
  if (trimmed === "") return trimmed;
  return /s$/i.test(trimmed) ? `${trimmed}’` : `${trimmed}’s`;
}
