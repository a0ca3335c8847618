// Form values → what a browser would post: nested objects as dotted names, lists of objects by
// index (steel.fy[1].fy), a ticked box as "on" and an unticked one not at all.
export function formFields(values: Record<string, unknown>, prefix = ""): Record<string, string | string[]> {
  const out: Record<string, string | string[]> = {};
  const walk = (o: unknown, p: string) => {
    if (Array.isArray(o) && o.some((x) => x && typeof x === "object")) o.forEach((x, i) => walk(x, `${p}[${i}]`));
    else if (Array.isArray(o)) out[p] = o.map(String);
    else if (o && typeof o === "object") for (const [k, v] of Object.entries(o)) walk(v, p ? `${p}.${k}` : k);
    else if (o === true) out[p] = "on";
    else if (o !== undefined && o !== false && o !== null) out[p] = String(o);
  };
  walk(values, prefix);
  return out;
}

export function formData(values: Record<string, unknown>, prefix = ""): FormData {
  const fd = new FormData();
  for (const [k, v] of Object.entries(formFields(values, prefix))) for (const one of Array.isArray(v) ? v : [v]) fd.append(k, one);
  return fd;
}
