import type { Metadata } from "next";
import { getDb } from "@/db/client";
import { requirePageUser } from "@/lib/auth/guard";
import { getShopSettings, settingsToForm } from "@/lib/shop/settings";
import { PageHeader } from "@/components/ui/page-header";
import { SettingsForm } from "./settings-form";

export const metadata: Metadata = { title: "Shop settings" };

export default async function SettingsPage() {
  await requirePageUser("/owner/settings", "owner");
  const settings = getShopSettings(getDb());
  return (
    <>
      <PageHeader title="Shop settings" subtitle="Rates, tax and the rules your reports use." />
      <SettingsForm initial={settingsToForm(settings)} />
    </>
  );
}
