/**
 * How sure we are of a fact we print:
 * - "read": read in a published copy;
 * - "memory": recalled; confirm before relying on it;
 * - "practice": common practice with no single source (a soft warning or an owner-set default, never a hard pass/fail).
 */
export type SourceMarker = "read" | "memory" | "practice";

/** A statement with its source and marker. */
export type Cited = { text: string; source: string; marker: SourceMarker };
