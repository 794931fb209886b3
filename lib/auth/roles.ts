export const ROLES = ["owner", "counter", "tech"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  owner: "Owner",
  counter: "Counter",
  tech: "Bench technician",
};

/** Where each role lands after signing in. */
export function homeFor(role: Role): string {
  return role === "tech" ? "/bench" : "/counter";
}
