import { redirect } from "react-router";
import { parseWithZod } from "@conform-to/zod/v4";
import type { Route } from "./+types/projects.new";
import { requirePermission } from "~/lib/auth.server";
import { readForm } from "~/lib/forms.server";
import { createProject, projectFormSchema } from "~/lib/projects.server";
import { ProjectFields } from "~/components/ProjectFields";
import { formFailure } from "~/lib/form-reply.server";

export function meta() {
  return [{ title: "New project · Sparwise" }];
}

export async function loader({ request }: Route.LoaderArgs) {
  await requirePermission(request, "createProject");
  return null;
}

export async function action({ request }: Route.ActionArgs) {
  const user = await requirePermission(request, "createProject");
  const submission = parseWithZod(await readForm(request), { schema: projectFormSchema });
  if (submission.status !== "success") return formFailure(submission);
  const id = await createProject(user.teamId, user.id, submission.value);
  throw redirect(`/projects/${id}`);
}

export default function NewProject({ actionData }: Route.ComponentProps) {
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">New project</h1>
      <ProjectFields lastResult={actionData?.result} submitLabel="Create project" />
    </div>
  );
}
