import { data } from "react-router";
import type { z } from "zod";

// Every action reads its body through here, so an oversized or malformed post becomes a clear
// 4xx before any handler logic runs (never a 500, never half a record).

export const DEFAULT_FORM_LIMIT = 64 * 1024;
export const DEFAULT_JSON_LIMIT = 256 * 1024;

export type FieldErrors = Record<string, string>;

function kB(bytes: number): string {
  return `${Math.round(bytes / 1024)} kB`;
}

function plain(status: number, message: string): Response {
  return new Response(message, { status, headers: { "Content-Type": "text/plain; charset=utf-8" } });
}

/**
 * How much of an oversized body is read and thrown away so the client gets its 413: a server
 * that stops reading and closes makes the client see a connection reset instead of the answer.
 * Past this the connection is cut (server.ts refuses a declared length over it unread).
 */
export const DRAIN_CAP = 16 * 1024 * 1024;

/**
 * Reads at most maxBytes of the body, whatever Content-Length claims (it may be absent or lie).
 * On overflow, tooBig gets the bytes read so far, so the message can name the field being sent;
 * the rest is drained (kept nowhere) up to DRAIN_CAP before the answer goes out.
 */
async function readCapped(request: Request, maxBytes: number, tooBig: (prefix: Uint8Array) => Response): Promise<Uint8Array> {
  if (!request.body) return new Uint8Array();
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    chunks.push(value);
    if (total > maxBytes) {
      const answer = tooBig(concat(chunks, total));
      chunks.length = 0;
      await drain(reader, total);
      throw answer;
    }
  }
  return concat(chunks, total);
}

async function drain(reader: ReadableStreamDefaultReader<Uint8Array>, seen: number): Promise<void> {
  try {
    for (let total = seen; total <= DRAIN_CAP; ) {
      const { done, value } = await reader.read();
      if (done) return;
      total += value.byteLength;
    }
    await reader.cancel();
  } catch {
    // The client went away: nothing left to answer.
  }
}

function concat(chunks: Uint8Array[], total: number): Uint8Array {
  const out = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

/** The form field whose value was being sent when the size limit was hit. */
function fieldAtCutoff(prefix: Uint8Array, contentType: string): string | null {
  const text = new TextDecoder("utf-8", { fatal: false }).decode(prefix.subarray(0, Math.min(prefix.byteLength, 4 * 1024 * 1024)));
  if (contentType.startsWith("multipart/form-data")) {
    const names = [...text.matchAll(/content-disposition:[^\r\n]*\bname="([^"]{1,100})"/gi)];
    return names.length ? names[names.length - 1]![1]! : null;
  }
  const last = text.slice(text.lastIndexOf("&") + 1);
  const eq = last.indexOf("=");
  if (eq <= 0 || eq > 100) return null;
  try {
    return decodeURIComponent(last.slice(0, eq).replace(/\+/g, " "));
  } catch {
    return null;
  }
}

/** The posted form, or a thrown 413/415/400 text Response the error boundary can show. */
export async function readForm(request: Request, maxBytes = DEFAULT_FORM_LIMIT): Promise<FormData> {
  const type = (request.headers.get("content-type") ?? "").toLowerCase();
  const bytes = await readCapped(request, maxBytes, (prefix) => {
    const field = fieldAtCutoff(prefix, type);
    return plain(413, field ? `${field}: too large; the form must stay under ${kB(maxBytes)}.` : `The form is too large: body over ${kB(maxBytes)}.`);
  });
  if (bytes.byteLength === 0) return new FormData();
  if (!type.startsWith("application/x-www-form-urlencoded") && !type.startsWith("multipart/form-data")) {
    throw plain(415, "The body is not a form: send application/x-www-form-urlencoded or multipart/form-data.");
  }
  try {
    return await new Request("http://form.invalid/", {
      method: "POST",
      body: bytes as unknown as BodyInit,
      headers: { "content-type": request.headers.get("content-type") ?? "" },
    }).formData();
  } catch {
    throw plain(400, "The form body is malformed and could not be read.");
  }
}

/** The posted JSON value, or a thrown JSON error Response (413 / 400) for API routes. */
export async function readJson(request: Request, maxBytes = DEFAULT_JSON_LIMIT): Promise<unknown> {
  const bytes = await readCapped(request, maxBytes, () =>
    Response.json({ error: `body over ${kB(maxBytes)}` }, { status: 413 }),
  );
  const text = new TextDecoder().decode(bytes);
  if (!text.trim()) throw Response.json({ error: "body is empty: send a JSON object" }, { status: 400 });
  try {
    return JSON.parse(text);
  } catch {
    throw Response.json({ error: "body is not valid JSON" }, { status: 400 });
  }
}

/** The standard answer to a form with field errors: `{ errors: { field: message } }`, status 400. */
export function badRequest(fieldErrors: FieldErrors, status = 400) {
  return data({ errors: fieldErrors }, { status });
}

/**
 * FormData → plain object for zod. Blank text fields become undefined so "required" reads as
 * required rather than as a type error; repeated keys become arrays.
 */
export function formToObject(form: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const key of new Set(form.keys())) {
    const values = form.getAll(key).map((v) => (typeof v === "string" && v.trim() === "" ? undefined : v));
    const present = values.filter((v) => v !== undefined);
    out[key] = values.length > 1 ? present : values[0];
  }
  return out;
}

function humanise(field: string): string {
  const words = field.replace(/([a-z])([A-Z])/g, "$1 $2").replace(/[_.]/g, " ").toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** zod issues → one message per field (the first), each naming its field. */
export function fieldErrorsFrom(error: z.ZodError, input?: Record<string, unknown>): FieldErrors {
  const errors: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join(".") : "form";
    if (errors[key]) continue;
    const missing = input && issue.path.length === 1 && input[String(issue.path[0])] === undefined;
    errors[key] = missing ? `${humanise(key)} is required.` : `${humanise(key)}: ${issue.message}`;
  }
  return errors;
}

export type Parsed<T> = { ok: true; data: T } | { ok: false; errors: FieldErrors };

/** zod safeParse over a form, with field-named messages. */
export function parseForm<S extends z.ZodType>(form: FormData, schema: S): Parsed<z.output<S>> {
  const input = formToObject(form);
  const result = schema.safeParse(input);
  if (result.success) return { ok: true, data: result.data };
  return { ok: false, errors: fieldErrorsFrom(result.error, input) };
}

/** A rule broken deep in a module (e.g. "already a member"): routes turn it into badRequest({ [field]: message }). */
export class FieldError extends Error {
  constructor(
    readonly field: string,
    message: string,
    readonly status = 400,
  ) {
    super(message);
    this.name = "FieldError";
  }
}

/** Runs a module call; a FieldError becomes the 4xx `{ errors }` answer, anything else propagates. */
export async function withFieldErrors<T>(run: () => Promise<T>) {
  try {
    return await run();
  } catch (error) {
    if (error instanceof FieldError) return badRequest({ [error.field]: error.message }, error.status);
    throw error;
  }
}
