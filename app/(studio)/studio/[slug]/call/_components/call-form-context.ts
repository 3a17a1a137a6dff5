import { useFormContext, useFormState } from "react-hook-form";
import type { CallInput, CallParsed } from "@/lib/validations/call";

/** The call form's fields and their errors, for the sections drawn inside its FormProvider. */
export function useCallForm() {
  const form = useFormContext<CallInput, unknown, CallParsed>();
  const { errors } = useFormState({ control: form.control });
  return { ...form, errors };
}
