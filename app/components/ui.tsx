// Small form pieces shared by the account, admin and sign-in pages: one look for labels, errors, buttons.
import type { InputHTMLAttributes, ReactNode } from "react";
import { SparwiseMark } from "~/components/AppHeader";

export function Field({
  label,
  name,
  error,
  hint,
  ...input
}: { label: string; name: string; error?: string; hint?: string } & InputHTMLAttributes<HTMLInputElement>) {
  const id = input.id ?? `f-${name}`;
  const describedBy = [error ? `${id}-error` : "", hint ? `${id}-hint` : ""].filter(Boolean).join(" ") || undefined;
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-semibold">
        {label}
      </label>
      <input
        id={id}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`block w-full rounded-md border bg-white px-3 py-2 text-ink ${error ? "border-red-700" : "border-ink/30"}`}
        {...input}
      />
      {hint && (
        <p id={`${id}-hint`} className="text-xs text-ink/70">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-sm font-semibold text-red-800">
          {error}
        </p>
      )}
    </div>
  );
}

export function Button({ children, variant = "primary", ...rest }: { children: ReactNode; variant?: "primary" | "quiet" | "danger" } & React.ButtonHTMLAttributes<HTMLButtonElement>) {
  const look = {
    primary: "bg-accent text-white hover:bg-accent-strong",
    quiet: "border border-ink/30 bg-white text-ink hover:bg-ink/5",
    danger: "border border-red-800 bg-white text-red-800 hover:bg-red-50",
  }[variant];
  return (
    <button type="submit" {...rest} className={`rounded-md px-4 py-2 text-sm font-semibold disabled:opacity-60 ${look} ${rest.className ?? ""}`}>
      {children}
    </button>
  );
}

export function FormError({ message }: { message?: string }) {
  if (!message) return null;
  return (
    <p role="alert" className="rounded-md border border-red-800 bg-red-50 px-3 py-2 text-sm font-semibold text-red-900">
      {message}
    </p>
  );
}

export function Notice({ message }: { message?: string | null }) {
  if (!message) return null;
  return (
    <p role="status" className="rounded-md border border-accent bg-teal-50 px-3 py-2 text-sm text-ink">
      {message}
    </p>
  );
}

/** The centred card the public pages (sign-in, invitation, reset) sit in. */
export function PublicCard({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="flex min-h-screen flex-col items-center justify-start px-4 py-12 sm:justify-center">
      <p className="mb-6 flex items-center gap-2 text-accent-strong">
        <SparwiseMark className="h-8 w-8" />
        <span className="text-xl font-bold tracking-tight text-ink">Sparwise</span>
      </p>
      <div className="w-full max-w-md rounded-xl border border-ink/15 bg-white p-6 shadow-sm sm:p-8">
        <h1 className="mb-6 text-2xl font-bold">{title}</h1>
        {children}
      </div>
      <p className="mt-6 max-w-md text-center text-xs text-ink/70">
        The lightest buildable beam section for your moment and shear, searched exactly and checked by your team.
      </p>
    </main>
  );
}
