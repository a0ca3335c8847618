// Typed error for bad engine input: names the field and the rule broken, so routes can
// answer 400 with it and forms can attach it to the right input.
export class EngineInputError extends Error {
  readonly field: string;
  constructor(field: string, message: string) {
    super(message);
    this.name = "EngineInputError";
    this.field = field;
  }
}

export function isEngineInputError(e: unknown): e is EngineInputError {
  return e instanceof EngineInputError;
}
