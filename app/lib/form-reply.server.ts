// Conform's reply for a failed submission, answered with a 4xx (not 200) and with the field
// errors also flattened to { field: message }, the shape every other action here returns.
import { data } from "react-router";
import type { Submission } from "@conform-to/react";

export function formFailure<T>(submission: Submission<T, string[], unknown>, status = 400, formErrors?: string[]) {
  const result = formErrors ? submission.reply({ formErrors }) : submission.reply();
  const errors: Record<string, string> = {};
  for (const [k, v] of Object.entries(result.error ?? {})) if (v && v.length) errors[k || "form"] = v.join("; ");
  if (formErrors?.length) errors.form = formErrors.join("; ");
  return data({ result, errors }, { status });
}
