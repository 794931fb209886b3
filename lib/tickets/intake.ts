/**
 * The counter's quick picks at intake, in Benchwright's own words. Keys are stored on the ticket
 * (tickets.complaint_tags, tickets.intake_condition.flags); labels are for display only.
 */
export const COMPLAINT_PICKS = [
  "wont_start",
  "leaks_fuel",
  "runs_rough",
  "stalls_at_idle",
  "no_power",
  "chain_or_blade",
  "service",
] as const;
export type ComplaintPick = (typeof COMPLAINT_PICKS)[number];

export const COMPLAINT_LABELS: Record<ComplaintPick, string> = {
  wont_start: "Won't start",
  leaks_fuel: "Leaks fuel",
  runs_rough: "Runs rough",
  stalls_at_idle: "Stalls at idle",
  no_power: "No power in the cut",
  chain_or_blade: "Chain or blade problem",
  service: "Service",
};

export const CONDITION_FLAGS = [
  "housing_damage",
  "missing_bar_cover",
  "chain_loose",
  "chain_backwards",
  "fuel_in_tank",
] as const;
export type ConditionFlag = (typeof CONDITION_FLAGS)[number];

export const CONDITION_LABELS: Record<ConditionFlag, string> = {
  housing_damage: "Housing damage",
  missing_bar_cover: "Missing bar cover",
  chain_loose: "Chain loose",
  chain_backwards: "Chain fitted backwards",
  fuel_in_tank: "Fuel in the tank",
};

export const CONTACT_PREFERENCES = ["phone", "text", "email"] as const;
export type ContactPreference = (typeof CONTACT_PREFERENCES)[number];

export const CONTACT_LABELS: Record<ContactPreference, string> = {
  phone: "Call",
  text: "Text message",
  email: "E-mail",
};

export function complaintLabel(key: string): string {
  return (COMPLAINT_LABELS as Record<string, string>)[key] ?? key;
}

export function conditionLabel(key: string): string {
  return (CONDITION_LABELS as Record<string, string>)[key] ?? key;
}

/** The complaint in one line: picks first, then the counter's own words. */
export function complaintSummary(picks: readonly string[], text: string): string {
  const labels = picks.map(complaintLabel);
  const t = text.trim();
  return [labels.join(", "), t].filter(Boolean).join(" — ");
}
