"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { getDb } from "@/db/client";
import { formAction } from "@/lib/http/action";
import { ROLES } from "@/lib/auth/roles";
import { createUser, newUserSchema, passwordSchema, resetPassword, setUserActive, setUserRole } from "@/lib/people/users";

const idSchema = z.object({ id: z.string().uuid("Unknown person.") });

export const addPersonAction = formAction(["owner"], newUserSchema, async (data, user) => {
  await createUser(getDb(), data, user.id);
  revalidatePath("/owner/people");
  return `${data.name} can now sign in as ${data.email}.`;
});

export const changeRoleAction = formAction(
  ["owner"],
  idSchema.extend({ role: z.enum(ROLES, { message: "Choose a role." }) }),
  async ({ id, role }, user) => {
    setUserRole(getDb(), id, role, user.id);
    revalidatePath("/owner/people");
    return "Role changed.";
  },
);

export const setActiveAction = formAction(
  ["owner"],
  idSchema.extend({ active: z.enum(["yes", "no"]).transform((v) => v === "yes") }),
  async ({ id, active }, user) => {
    setUserActive(getDb(), id, active, user.id);
    revalidatePath("/owner/people");
    return active ? "Account switched on." : "Account switched off; its sessions have ended.";
  },
);

export const resetPasswordAction = formAction(
  ["owner"],
  idSchema.extend({ password: passwordSchema }),
  async ({ id, password }, user) => {
    await resetPassword(getDb(), id, password, user.id);
    revalidatePath("/owner/people");
    return "Password set; the person's other sessions have ended.";
  },
);
