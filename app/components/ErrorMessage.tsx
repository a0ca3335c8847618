// What a refused or failed page says, in the app's frame (app-layout.tsx) for signed-in people and
// on its own (root.tsx) where there is no frame: one wording for both.
import { isRouteErrorResponse } from "react-router";

export function errorWords(error: unknown): { status: number; title: string; detail: string } {
  if (isRouteErrorResponse(error)) {
    const title = error.status === 404 ? "Not found" : error.status === 403 ? "Not allowed" : `Error ${error.status}`;
    const fallback = error.status === 404 ? "There is nothing at this address, or it belongs to another team." : error.status === 403 ? "Your role in this team does not allow this." : "";
    const detail = typeof error.data === "string" && error.data ? error.data : error.statusText || fallback || "The request could not be completed.";
    return { status: error.status, title, detail };
  }
  return { status: 500, title: "Something went wrong", detail: "An unexpected error occurred. Nothing you saved was lost." };
}

export function ErrorMessage({ error }: { error: unknown }) {
  const { status, title, detail } = errorWords(error);
  return (
    <section className="mx-auto max-w-xl py-8" data-testid="error-page" data-status={status} aria-labelledby="error-h">
      <h1 id="error-h" className="text-2xl font-bold">
        {title}
      </h1>
      <p className="mt-2">{detail}</p>
      <a className="mt-4 inline-block text-accent underline" href="/">
        Back to the dashboard
      </a>
    </section>
  );
}
