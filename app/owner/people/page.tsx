import type { Metadata } from "next";
import { getDb } from "@/db/client";
import { requirePageUser } from "@/lib/auth/guard";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { listUsers } from "@/lib/people/users";
import { PageHeader } from "@/components/ui/page-header";
import { AddPersonForm, PersonControls } from "./people-forms";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage() {
  const me = await requirePageUser("/owner/people", "owner");
  const people = listUsers(getDb());
  return (
    <>
      <PageHeader title="People" subtitle="Who can sign in, and what each role may do." />
      <section aria-labelledby="people-list" className="mb-10">
        <h2 id="people-list" className="sr-only">Everyone</h2>
        <ul className="flex flex-col gap-4">
          {people.map((p) => (
            <li key={p.id} className="rounded-2xl border border-line bg-surface p-4">
              <div className="mb-3 flex flex-wrap items-baseline gap-x-3">
                <p className="text-xl font-bold">{p.name}</p>
                <p className="text-muted">{p.email}</p>
                <p className="font-semibold">{ROLE_LABELS[p.role]}</p>
                {!p.active ? <p className="rounded-lg bg-bad-soft px-2 font-bold text-bad">Switched off</p> : null}
                {p.id === me.id ? <p className="text-sm text-muted">(you)</p> : null}
              </div>
              <PersonControls id={p.id} name={p.name} role={p.role} active={p.active} isSelf={p.id === me.id} />
            </li>
          ))}
        </ul>
      </section>
      <section aria-labelledby="add-person" className="rounded-2xl border border-line bg-surface p-5">
        <h2 id="add-person" className="mb-4 text-2xl font-bold">Add a person</h2>
        <AddPersonForm />
      </section>
    </>
  );
}
