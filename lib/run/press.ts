/**
 * Which collective an anthology's prices belong to: its press name (trimmed, case folded, so
 * "Marrowbend Print Collective" and "marrowbend print collective " share one list), or, for an
 * anthology that names no press, its lead's own lists.
 */
export function pressKeyOf(anthology: { pressName: string | null; createdBy: string }): string {
  const name = anthology.pressName?.trim().replace(/\s+/g, " ").toLowerCase() ?? "";
  return name !== "" ? `press:${name}` : `lead:${anthology.createdBy}`;
}
