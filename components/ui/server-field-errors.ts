import type { FieldValues, Path, UseFormSetError } from "react-hook-form";

/**
 * Puts the server's field messages (`{ fields: { name: [message, …] } }`, as lib/api.ts and the
 * server actions answer) beside the form's own inputs. Nested paths land on their top field.
 */
export function showServerFieldErrors<T extends FieldValues>(
  setError: UseFormSetError<T>,
  fields: unknown,
): void {
  for (const [name, messages] of Object.entries((fields ?? {}) as Record<string, string[]>)) {
    setError(name.split(".")[0] as Path<T>, { message: messages[0] ?? "Check this field" });
  }
}
