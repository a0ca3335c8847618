// Project name, client, job number and description, validated by projectFormSchema on both sides (Conform).
import { Form } from "react-router";
import { getFormProps, getInputProps, getTextareaProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { projectFormSchema } from "~/lib/project-form";

export function ProjectFields({ lastResult, defaultValue, submitLabel }: { lastResult?: unknown; defaultValue?: Record<string, string | null>; submitLabel: string }) {
  const [form, fields] = useForm({
    lastResult: lastResult as never,
    defaultValue: defaultValue as never,
    shouldValidate: "onBlur",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: projectFormSchema }),
  });
  const err = (f: { errors?: string[]; errorId: string }) =>
    f.errors ? (
      <p id={f.errorId} className="text-sm font-semibold text-red-800">
        {f.errors.join("; ")}
      </p>
    ) : null;
  return (
    <Form method="post" {...getFormProps(form)} className="max-w-xl space-y-3">
      <input type="hidden" name="intent" value="edit" />
      <div className="space-y-1">
        <label htmlFor={fields.name.id} className="block text-sm font-semibold">
          Project name
        </label>
        <input {...getInputProps(fields.name, { type: "text" })} key={fields.name.key} className="block w-full rounded-md border border-ink/30 bg-white px-2 py-1.5" />
        {err(fields.name)}
      </div>
      <div className="space-y-1">
        <label htmlFor={fields.client.id} className="block text-sm font-semibold">
          Client
        </label>
        <input {...getInputProps(fields.client, { type: "text" })} key={fields.client.key} className="block w-full rounded-md border border-ink/30 bg-white px-2 py-1.5" />
        {err(fields.client)}
      </div>
      <div className="space-y-1">
        <label htmlFor={fields.jobNumber.id} className="block text-sm font-semibold">
          Job number <span className="font-normal text-ink/70">(printed on every page of the calculation records)</span>
        </label>
        <input {...getInputProps(fields.jobNumber, { type: "text" })} key={fields.jobNumber.key} className="block w-full max-w-xs rounded-md border border-ink/30 bg-white px-2 py-1.5" />
        {err(fields.jobNumber)}
      </div>
      <div className="space-y-1">
        <label htmlFor={fields.description.id} className="block text-sm font-semibold">
          Description
        </label>
        <textarea {...getTextareaProps(fields.description)} key={fields.description.key} rows={3} className="block w-full rounded-md border border-ink/30 bg-white px-2 py-1.5" />
        {err(fields.description)}
      </div>
      <button type="submit" className="rounded-md bg-accent px-4 py-2 text-sm font-semibold text-white">
        {submitLabel}
      </button>
    </Form>
  );
}

