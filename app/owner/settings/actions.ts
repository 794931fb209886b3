"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/client";
import { formAction } from "@/lib/http/action";
import { saveShopSettings, settingsFormSchema } from "@/lib/shop/settings";

export const saveSettingsAction = formAction(["owner"], settingsFormSchema, async (data, user) => {
  saveShopSettings(getDb(), data, user.id);
  revalidatePath("/owner/settings");
  return "Shop settings saved.";
});
