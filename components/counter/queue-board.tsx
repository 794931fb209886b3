"use client";

import Link from "next/link";
import { useMemo, useState, useEffect } from "react";
import { keepPreviousData, useQuery, useQueryClient } from "@tanstack/react-query";
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import { ArrowDown, ArrowUp, ArrowUpDown, CloudOff, RotateCcw, Search } from "lucide-react";
import type { QueuePage, QueueRow, QueueSort } from "@/lib/counter/queue";
import { dateIn, formatDate, timeIn } from "@/lib/counter/dates";
import { OPEN_STATUSES, STATUS_LABELS, type TicketStatus } from "@/lib/tickets/status";
import { formatTagCode } from "@/lib/trade/tag-code";
import { buttonClass } from "@/components/ui/button";
import { apiJson, ApiError } from "./api";
import { StatusBadge } from "./status-badge";
import { MoveStatusButton, TechSelect } from "./ticket-controls";

export interface BoardParams {
  status?: TicketStatus;
  tech?: string;
  overdue?: boolean;
  q?: string;
  sort: QueueSort;
  dir: "asc" | "desc";
  page: number;
}

export const DEFAULT_BOARD: BoardParams = { sort: "promised", dir: "asc", page: 1 };
const PAGE_SIZE = 25;
const REFRESH_MS = 5_000;

export function boardSearch(p: BoardParams): string {
  const s = new URLSearchParams();
  if (p.status) s.set("status", p.status);
  if (p.tech) s.set("tech", p.tech);
  if (p.overdue) s.set("overdue", "1");
  if (p.q) s.set("q", p.q);
  if (p.sort !== DEFAULT_BOARD.sort || p.dir !== DEFAULT_BOARD.dir) {
    s.set("sort", p.sort);
    s.set("dir", p.dir);
  }
  if (p.page > 1) s.set("page", String(p.page));
  return s.toString();
}

function when(iso: string, tz: string, today: string): string {
  const day = dateIn(tz, Date.parse(iso));
  return day === today ? `Today ${timeIn(tz, Date.parse(iso))}` : formatDate(day, { year: false });
}

function Promised({ row, today }: { row: QueueRow; today: string }) {
  if (!row.promisedDate) return <span className="text-muted">—</span>;
  const label = row.promisedDate === today ? "Today" : formatDate(row.promisedDate, { year: false });
  return (
    <span className="flex flex-col items-start gap-1">
      <span className={"whitespace-nowrap " + (row.overdue ? "font-bold text-bad" : "")}>{label}</span>
      {row.overdue ? <span className="rounded-md bg-bad-soft px-1.5 text-sm font-bold text-bad">Overdue</span> : null}
    </span>
  );
}

function Marks({ row, tz }: { row: QueueRow; tz: string }) {
  return (
    <>
      {row.comebackOfTicketId ? (
        <span className="rounded-md border border-ink-2 px-1.5 text-sm font-bold" title="Back within the comeback window after an earlier hand-back">
          <RotateCcw size={14} aria-hidden className="mr-1 inline" />
          Comeback
        </span>
      ) : null}
      {row.unsynced ? (
        <span className="rounded-md bg-accent-soft px-1.5 text-sm font-bold" title={`Reported ${when(new Date(row.unsynced.reportedAt).toISOString(), tz, "")}`}>
          <CloudOff size={14} aria-hidden className="mr-1 inline" />
          {row.unsynced.changes} unsynced on {row.unsynced.deviceUser}&apos;s phone
        </span>
      ) : null}
    </>
  );
}

const col = createColumnHelper<QueueRow>();

export function QueueBoard({ initial, initialParams, timezone }: { initial: QueuePage; initialParams: BoardParams; timezone: string }) {
  const [params, setParams] = useState<BoardParams>(initialParams);
  const [searchText, setSearchText] = useState(initialParams.q ?? "");
  const queryClient = useQueryClient();
  const search = boardSearch(params);
  const initialSearch = boardSearch(initialParams);

  const query = useQuery({
    queryKey: ["queue", search],
    queryFn: () => apiJson<QueuePage>(`/api/counter/queue?${search}${search ? "&" : ""}pageSize=${PAGE_SIZE}`),
    initialData: search === initialSearch ? initial : undefined,
    placeholderData: keepPreviousData,
    refetchInterval: REFRESH_MS,
    refetchOnWindowFocus: true,
  });
  const data = query.data ?? initial;
  const refresh = () => void queryClient.invalidateQueries({ queryKey: ["queue"] });

  // Keep the address in step so a reload or a shared link shows the same board.
  useEffect(() => {
    const url = `${window.location.pathname}${search ? `?${search}` : ""}`;
    if (url !== `${window.location.pathname}${window.location.search}`) window.history.replaceState(null, "", url);
  }, [search]);

  // The search box waits for a pause in typing.
  useEffect(() => {
    const t = setTimeout(() => {
      const q = searchText.trim() || undefined;
      setParams((p) => (p.q === q ? p : { ...p, q, page: 1 }));
    }, 300);
    return () => clearTimeout(t);
  }, [searchText]);

  const set = (patch: Partial<BoardParams>) => setParams((p) => ({ ...p, page: 1, ...patch }));

  const columns = useMemo(
    () => [
      col.accessor("tagCode", {
        id: "number",
        header: "Tag",
        cell: ({ row: { original: r } }) => (
          <div className="flex flex-col items-start gap-1">
            <Link href={`/counter/tickets/${r.id}`} className="font-mono text-lg font-bold whitespace-nowrap underline-offset-4 hover:underline">
              {formatTagCode(r.tagCode)}
            </Link>
            <span className="text-sm text-muted">#{r.number}</span>
            <Marks row={r} tz={timezone} />
          </div>
        ),
      }),
      col.accessor((r) => r.customer.lastName, {
        id: "customer",
        header: "Customer and machine",
        cell: ({ row: { original: r } }) => (
          <div className="max-w-80">
            <div>
              <span className="font-semibold">{r.customer.lastName}</span>
              {r.customer.firstName ? <span className="text-ink-2">, {r.customer.firstName}</span> : null}
            </div>
            <div>
              {r.machine.make} {r.machine.model} <span className="text-muted">· {r.machine.kindLabel}</span>
            </div>
            <p className="mt-1 line-clamp-2 text-sm text-ink-2">{r.complaint}</p>
          </div>
        ),
      }),
      col.accessor("status", {
        id: "status",
        header: "Status",
        cell: ({ row: { original: r } }) => (
          <div className="flex flex-col items-start gap-2">
            <StatusBadge status={r.status} />
            <MoveStatusButton ticket={r} onMoved={refresh} compact />
          </div>
        ),
      }),
      col.accessor((r) => r.tech?.name ?? "", {
        id: "tech",
        header: "Tech",
        cell: ({ row: { original: r } }) => <TechSelect ticket={r} techId={r.tech?.id ?? null} techs={data.techs} onChanged={refresh} />,
      }),
      col.accessor("daysInShop", {
        id: "days",
        header: "In shop",
        cell: (c) => <span className="text-lg font-semibold whitespace-nowrap tabular-nums">{c.getValue()} d</span>,
      }),
      col.accessor("promisedDate", {
        id: "promised",
        header: "Promised",
        cell: ({ row: { original: r } }) => <Promised row={r} today={data.today} />,
      }),
      col.accessor("lastActivityAt", {
        id: "activity",
        header: "Last activity",
        cell: (c) => <span className="whitespace-nowrap">{when(c.getValue(), timezone, data.today)}</span>,
      }),
    ],
    [data.techs, data.today, timezone],
  );

  const sorting: SortingState = [{ id: params.sort, desc: params.dir === "desc" }];
  const table = useReactTable({
    data: data.rows,
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    pageCount: data.pageCount,
    state: { sorting },
    getRowId: (r) => r.id,
  });

  function sortBy(id: string) {
    const sort = id as QueueSort;
    set(params.sort === sort ? { sort, dir: params.dir === "asc" ? "desc" : "asc" } : { sort, dir: "asc" });
  }

  const totalOpen = OPEN_STATUSES.reduce((a, s) => a + data.counts[s], 0);
  const error = query.error instanceof ApiError ? query.error : null;

  return (
    <div className="flex flex-col gap-5">
      <div role="group" aria-label="Filter by status" className="-mx-1 flex gap-2 overflow-x-auto px-1 pb-1 sm:flex-wrap">
        {[undefined, ...OPEN_STATUSES].map((s) => {
          const active = params.status === s;
          const n = s ? data.counts[s] : totalOpen;
          return (
            <button
              key={s ?? "all"}
              type="button"
              aria-pressed={active}
              onClick={() => set({ status: s })}
              className={
                "tap flex shrink-0 items-center gap-2 rounded-xl border-2 px-3 font-semibold " +
                (active ? "border-accent bg-accent text-accent-ink" : "border-line bg-surface hover:border-accent")
              }
            >
              {s ? STATUS_LABELS[s] : "All open"}
              <span className={"rounded-md px-1.5 tabular-nums " + (active ? "bg-accent-ink/20" : "bg-surface-2")}>{n}</span>
            </button>
          );
        })}
      </div>

      <div className="flex flex-wrap items-end gap-3">
        <div className="flex min-w-60 flex-1 flex-col gap-1">
          <label htmlFor="queue-search" className="font-semibold">
            Search
          </label>
          <div className="relative">
            <Search size={20} aria-hidden className="pointer-events-none absolute top-1/2 left-3 -translate-y-1/2 text-muted" />
            <input
              id="queue-search"
              type="search"
              value={searchText}
              onChange={(e) => setSearchText(e.target.value)}
              placeholder="Tag, ticket #, name, phone, make or serial"
              className="tap w-full rounded-xl border-2 border-line bg-surface pr-3 pl-10 text-lg focus:border-accent"
            />
          </div>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="queue-tech" className="font-semibold">
            Technician
          </label>
          <select
            id="queue-tech"
            value={params.tech ?? ""}
            onChange={(e) => set({ tech: e.target.value || undefined })}
            className="tap rounded-xl border-2 border-line bg-surface px-3 text-lg"
          >
            <option value="">Anyone</option>
            <option value="none">Unassigned</option>
            {data.techs.map((t) => (
              <option key={t.id} value={t.id}>
                {t.name}
              </option>
            ))}
          </select>
        </div>
        <label className="tap flex items-center gap-3 rounded-xl border-2 border-line bg-surface px-4 font-semibold has-[:checked]:border-bad has-[:checked]:bg-bad-soft">
          <input type="checkbox" checked={Boolean(params.overdue)} onChange={(e) => set({ overdue: e.target.checked || undefined })} className="size-5" />
          Overdue only
        </label>
        <div className="flex flex-col gap-1 xl:hidden">
          <label htmlFor="queue-sort" className="font-semibold">
            Sort
          </label>
          <select
            id="queue-sort"
            value={`${params.sort}:${params.dir}`}
            onChange={(e) => {
              const [sort, dir] = e.target.value.split(":") as [QueueSort, "asc" | "desc"];
              set({ sort, dir });
            }}
            className="tap rounded-xl border-2 border-line bg-surface px-3 text-lg"
          >
            <option value="promised:asc">Promised date</option>
            <option value="days:desc">Longest in the shop</option>
            <option value="activity:desc">Latest activity</option>
            <option value="status:asc">Status</option>
            <option value="customer:asc">Customer</option>
            <option value="number:desc">Newest ticket</option>
          </select>
        </div>
      </div>

      <p aria-live="polite" className="text-sm text-muted">
        {data.total} ticket{data.total === 1 ? "" : "s"}
        {params.status || params.tech || params.overdue || params.q ? " match" : " open"}
        {" · "}
        {query.isFetching ? "refreshing…" : `updated ${timeIn(timezone, query.dataUpdatedAt || Date.now())}`}
      </p>
      {error ? (
        <p role="alert" className="rounded-xl border-l-8 border-bad bg-bad-soft px-4 py-3 font-semibold">
          {error.status === 401 ? (
            <>
              You have been signed out. <a href="/sign-in?next=%2Fcounter" className="underline">Sign in again</a> to keep the board current.
            </>
          ) : (
            `The board could not refresh: ${error.message}`
          )}
        </p>
      ) : null}

      {/* Wide screens: the table. */}
      <div className="hidden overflow-x-auto rounded-2xl border border-line bg-surface xl:block">
        <table className="w-full text-left">
          <thead className="bg-surface-2 text-sm tracking-wide text-muted uppercase">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const sortable = h.column.getCanSort();
                  const active = params.sort === h.column.id;
                  return (
                    <th key={h.id} scope="col" className="px-2 py-2 align-bottom first:pl-4" aria-sort={active ? (params.dir === "asc" ? "ascending" : "descending") : undefined}>
                      {sortable ? (
                        <button type="button" onClick={() => sortBy(h.column.id)} className="tap -mx-2 flex items-center gap-1 rounded-lg px-2 uppercase hover:bg-surface">
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          {active ? params.dir === "asc" ? <ArrowUp size={16} aria-hidden /> : <ArrowDown size={16} aria-hidden /> : <ArrowUpDown size={16} aria-hidden className="opacity-40" />}
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className={"border-t border-line align-top " + (row.original.overdue ? "bg-bad-soft/40" : "")}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-2 py-3 first:pl-4">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        {data.rows.length === 0 ? <p className="px-4 py-8 text-center text-lg text-muted">No open tickets match.</p> : null}
      </div>

      {/* Tablets in portrait and phones: one card per ticket. */}
      <ul className="grid gap-3 lg:grid-cols-2 xl:hidden" aria-label="Open tickets">
        {table.getRowModel().rows.map(({ original: r }) => (
          <li key={r.id} className={"rounded-2xl border-2 bg-surface p-4 " + (r.overdue ? "border-bad" : "border-line")}>
            <div className="flex flex-wrap items-start justify-between gap-2">
              <div>
                <Link href={`/counter/tickets/${r.id}`} className="font-mono text-2xl font-bold underline-offset-4 hover:underline">
                  {formatTagCode(r.tagCode)}
                </Link>
                <span className="ml-2 text-muted">#{r.number}</span>
              </div>
              <StatusBadge status={r.status} />
            </div>
            <p className="mt-2 text-lg">
              <span className="font-semibold">{r.customer.lastName}</span>
              {r.customer.firstName ? `, ${r.customer.firstName}` : ""} · {r.machine.make} {r.machine.model}{" "}
              <span className="text-muted">({r.machine.kindLabel.toLowerCase()})</span>
            </p>
            <p className="mt-1 line-clamp-2 text-ink-2">{r.complaint}</p>
            <div className="mt-2 flex flex-wrap gap-2">
              <Marks row={r} tz={timezone} />
            </div>
            <dl className="mt-3 grid grid-cols-3 gap-2 text-sm">
              <div>
                <dt className="text-muted">In shop</dt>
                <dd className="text-lg font-semibold">{r.daysInShop} d</dd>
              </div>
              <div>
                <dt className="text-muted">Promised</dt>
                <dd className="text-base">
                  <Promised row={r} today={data.today} />
                </dd>
              </div>
              <div>
                <dt className="text-muted">Last activity</dt>
                <dd className="text-base">{when(r.lastActivityAt, timezone, data.today)}</dd>
              </div>
            </dl>
            <div className="mt-3 flex flex-wrap items-start gap-3">
              <TechSelect ticket={r} techId={r.tech?.id ?? null} techs={data.techs} onChanged={refresh} className="min-w-48 flex-1" />
              <MoveStatusButton ticket={r} onMoved={refresh} />
            </div>
          </li>
        ))}
        {data.rows.length === 0 ? <li className="py-8 text-center text-lg text-muted lg:col-span-2">No open tickets match.</li> : null}
      </ul>

      <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-muted">
          Page {data.page} of {data.pageCount}
        </p>
        <div className="flex gap-3">
          <button type="button" className={buttonClass("secondary")} disabled={data.page <= 1} onClick={() => setParams((p) => ({ ...p, page: data.page - 1 }))}>
            Previous
          </button>
          <button type="button" className={buttonClass("secondary")} disabled={data.page >= data.pageCount} onClick={() => setParams((p) => ({ ...p, page: data.page + 1 }))}>
            Next
          </button>
        </div>
      </nav>
    </div>
  );
}
