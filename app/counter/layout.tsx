import type { ReactNode } from "react";
import { getCurrentUser } from "@/lib/auth/guard";
import { StaffShell } from "@/components/shell/staff-shell";
import { CounterQueryProvider } from "@/components/counter/query-provider";

/** The shell only; each page calls the access guard itself (layouts do not re-run on every navigation). */
export default async function CounterLayout({ children }: { children: ReactNode }) {
  const user = await getCurrentUser();
  if (!user || user.role === "tech") return <>{children}</>;
  return (
    <StaffShell user={user}>
      <CounterQueryProvider>{children}</CounterQueryProvider>
    </StaffShell>
  );
}
