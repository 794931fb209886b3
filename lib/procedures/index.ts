/**
 * Procedures (bench-sheet templates): the model, the built-in sheets, validation and the guided next test.
 * Pure TypeScript + zod: no framework, no database.
 */
import type { EngineType, MachineKind } from "../tickets/machine";
import type { Procedure } from "./model";
import { CHAIN_SAW } from "./built-in/chain-saw";
import { HANDHELD } from "./built-in/handheld";
import { WALK_MOWER } from "./built-in/mower";
import { GENERATOR } from "./built-in/generator";

export * from "./model";
export * from "./values";
export * from "./conditions";
export * from "./validate";
export * from "./describe";

/** The procedures that ship with Benchwright, written from trade knowledge in our own words. */
export const BUILT_IN_PROCEDURES: readonly Procedure[] = [CHAIN_SAW, HANDHELD, WALK_MOWER, GENERATOR];

/**
 * The procedure for a machine: the first id that covers this machine kind and engine type, at its highest version.
 * `procedures` lets the shop's own (owner-edited) procedures be passed in; by default the built-in ones.
 * Undefined when none fits (e.g. an electric saw): the sheet then offers notes and photos only.
 */
export function procedureFor(
  machineKind: MachineKind,
  engineType: EngineType,
  procedures: readonly Procedure[] = BUILT_IN_PROCEDURES,
): Procedure | undefined {
  const fitting = procedures.filter((p) => p.machineKinds.includes(machineKind) && p.engineTypes.includes(engineType));
  const first = fitting[0];
  if (!first) return undefined;
  return fitting.filter((p) => p.id === first.id).reduce((a, b) => (b.version > a.version ? b : a));
}
