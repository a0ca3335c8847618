// The engine's one entry (engine contract). Pure: no I/O, no DOM.
export * from "./errors";
export * from "./composite";
export * from "./geometry";
export * from "./hollow";
export * from "./schema";
export * from "./properties";
export { findInputViolation, type Violation } from "./validate";
export * from "./stress";
export * from "./search-schema";
export { searchSections } from "./search";
export { PROGRESS_UNIT, type SearchOptions, type SearchResult, type SearchCandidate, type SearchPoint } from "./grid";
export { bruteForceSearch } from "./brute-force";
export { candidateChecks, CHECK_CLAUSES, CHECK_UNITS, type CheckResult, type CheckUnit, type CandidateVerdict } from "./checks";
export type * from "./design-types";
export * from "./units";
export * from "./materials";
export { rationalise, rationaliseInputSchema, candidateThicknesses, type RationaliseInput, type RationaliseResult, type RationaliseChoice } from "./rationalise";
export * from "./catalogue";
