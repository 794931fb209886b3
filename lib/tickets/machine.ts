export const MACHINE_KINDS = [
  "chain_saw",
  "string_trimmer",
  "blower",
  "hedge_trimmer",
  "walk_mower",
  "riding_mower",
  "tiller",
  "generator",
  "pressure_washer",
  "snow_thrower",
  "other",
] as const;
export type MachineKind = (typeof MACHINE_KINDS)[number];

export const MACHINE_KIND_LABELS: Record<MachineKind, string> = {
  chain_saw: "Chain saw",
  string_trimmer: "String trimmer",
  blower: "Blower",
  hedge_trimmer: "Hedge trimmer",
  walk_mower: "Walk-behind mower",
  riding_mower: "Riding mower",
  tiller: "Tiller",
  generator: "Generator",
  pressure_washer: "Pressure washer",
  snow_thrower: "Snow thrower",
  other: "Other",
};

export const ENGINE_TYPES = ["two_stroke", "four_stroke", "electric"] as const;
export type EngineType = (typeof ENGINE_TYPES)[number];

export const ENGINE_TYPE_LABELS: Record<EngineType, string> = {
  two_stroke: "Two-stroke",
  four_stroke: "Four-stroke",
  electric: "Electric",
};
