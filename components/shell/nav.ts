import type { Role } from "@/lib/auth/roles";

export interface NavItem {
  href: string;
  label: string;
  icon: "queue" | "intake" | "history" | "tools" | "bench" | "people" | "settings";
  roles: readonly Role[];
  section: "shop" | "owner";
}

/** The one list of staff navigation; each item names the roles that see it. */
export const NAV_ITEMS: readonly NavItem[] = [
  { href: "/counter", label: "Queue", icon: "queue", roles: ["counter", "owner"], section: "shop" },
  { href: "/counter/intake", label: "Take in", icon: "intake", roles: ["counter", "owner"], section: "shop" },
  { href: "/counter/history", label: "History", icon: "history", roles: ["counter", "owner"], section: "shop" },
  { href: "/bench", label: "Bench", icon: "bench", roles: ["tech", "counter", "owner"], section: "shop" },
  { href: "/tools", label: "Shop tools", icon: "tools", roles: ["tech", "counter", "owner"], section: "shop" },
  { href: "/owner/people", label: "People", icon: "people", roles: ["owner"], section: "owner" },
  { href: "/owner/settings", label: "Shop settings", icon: "settings", roles: ["owner"], section: "owner" },
];

export function navFor(role: Role): NavItem[] {
  return NAV_ITEMS.filter((item) => item.roles.includes(role));
}
