// How pages name sweeps and options: by their number within the project (numbering.server.ts).
export interface Numbers {
  sweep: Record<number, number>;
  option: Record<number, number>;
}

export const NO_NUMBERS: Numbers = { sweep: {}, option: {} };

/** The sweep's number in its project, or its id when it belongs to none. */
export function sweepNo(n: Numbers, id: number): number {
  return n.sweep[id] ?? id;
}

export function optionNo(n: Numbers, id: number): number {
  return n.option[id] ?? id;
}
