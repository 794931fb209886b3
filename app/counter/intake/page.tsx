import type { Metadata } from "next";
import { z } from "zod";
import { getDb } from "@/db/client";
import { requirePageUser } from "@/lib/auth/guard";
import { listTechs } from "@/lib/counter/people";
import { getCustomer, getMachine } from "@/lib/counter/search";
import { getShopSettings } from "@/lib/shop/settings";
import { CAUTIONS } from "@/lib/trade/cautions";
import { PageHeader } from "@/components/ui/page-header";
import { IntakeForm, type IntakePrefill } from "@/components/counter/intake-form";

export const metadata: Metadata = { title: "Take in a machine" };

const prefillQuery = z.object({ machine: z.uuid().optional(), customer: z.uuid().optional() });

export default async function IntakePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageUser("/counter/intake", "counter", "owner");
  const db = getDb();
  const q = prefillQuery.safeParse(await searchParams);
  const prefill: IntakePrefill = {};
  if (q.success) {
    const machine = q.data.machine ? getMachine(db, q.data.machine) : undefined;
    const customerId = q.data.customer ?? machine?.customerId ?? undefined;
    const customer = customerId ? getCustomer(db, customerId) : undefined;
    if (machine) prefill.machine = machine;
    if (customer) prefill.customer = customer;
  }
  return (
    <>
      <PageHeader title="Take in a machine" subtitle="Customer, machine, what's wrong. The tag prints when you save." />
      <IntakeForm
        techs={listTechs(db)}
        timezone={getShopSettings(db).timezone}
        fuelCaution={CAUTIONS.find((c) => c.id === "fuel-away-from-ignition") ?? null}
        prefill={prefill}
      />
    </>
  );
}
