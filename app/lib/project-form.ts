// A project's editable fields: one schema for the form (Conform, in the browser) and the action.
import { z } from "zod";

export const projectFormSchema = z.object({
  name: z.string({ error: "name is required" }).trim().min(1, "name is required").max(160, "name: at most 160 characters"),
  client: z.string().trim().max(160, "client: at most 160 characters").optional(),
  // printed in the calculation record's title block and running header
  jobNumber: z
    .string()
    .trim()
    .max(40, "job number: at most 40 characters")
    .regex(/^[^\p{Cc}]*$/u, "job number: one line of plain text")
    .optional(),
  description: z.string().trim().max(4000, "description: at most 4000 characters").optional(),
});

