"use client";
// The library's table (TanStack Table): the server has already filtered, sorted and paged the rows
// (manual sorting), so the table owns the columns shown, the sort the headers show, and the selection of
// kits to compare. Readouts are judged against each kit's effective targets.
import {
  columnVisibilityFeature,
  createColumnHelper,
  rowSelectionFeature,
  rowSortingFeature,
  tableFeatures,
  useTable,
  type ColumnDef,
  type RowSelectionState,
  type SortingState,
  type Updater,
  type ColumnVisibilityState,
} from "@tanstack/react-table";
import Link from "next/link";
import { useMemo } from "react";
import { JudgedFigure } from "@/components/ui/judged-figure";
import type { KitSummary } from "@/contracts/kits";
import type { LibrarySort } from "@/contracts/library";
import { COMPARE_MAX } from "@/contracts/compare";
import { effectiveTargets, READOUT_KEYS, type ReadoutKey, type Targets } from "@/contracts/targets";
import { limitLabel } from "@/figures/format";
import { LIBRARY_COLUMNS, type LibraryColumn } from "@/lib/library-url";
import { KitRowActions } from "./kit-row-actions";

const features = tableFeatures({ rowSortingFeature, columnVisibilityFeature, rowSelectionFeature });
const helper = createColumnHelper<typeof features, KitSummary>();

const dateFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

export const COLUMN_LABELS: Record<LibraryColumn, string> = {
  name: "Kit",
  scale: "Scale",
  author: "Author",
  updatedAt: "Updated",
  headRevision: "Revision",
  tags: "Tags",
  lockDeg: "Steer lock",
  maxJointAngleDeg: "Joint angle",
  ackermannPct: "Ackermann",
  safetyFactor: "Safety factor",
  neckClearanceMm: "Neck clearance",
};

// Which sort a header asks the server for.
const SORT_OF: Partial<Record<LibraryColumn, LibrarySort>> = {
  name: "name",
  scale: "scale",
  author: "author",
  updatedAt: "updatedAt",
  headRevision: "headRevision",
  lockDeg: "lockDeg",
  maxJointAngleDeg: "maxJointAngleDeg",
  ackermannPct: "ackermannPct",
  safetyFactor: "safetyFactor",
  neckClearanceMm: "neckClearanceMm",
};

type Ctx = { workspaceId: string; targets: Targets; canWrite: boolean };

function readoutColumn(key: ReadoutKey, ctx: Ctx): ColumnDef<typeof features, KitSummary, number | null> {
  return helper.accessor((k) => k.readouts[key], {
    id: key,
    header: COLUMN_LABELS[key],
    cell: (info) => {
      const kit = info.row.original;
      return (
        <div className="flex flex-col items-end">
          <JudgedFigure readout={key} value={info.getValue()} targets={effectiveTargets(ctx.targets, kit.targetOverrides)} />
          {key === "lockDeg" && kit.lockLimitedBy ? <span className="max-w-36 truncate text-[11px] text-ink-muted" title={limitLabel(kit.lockLimitedBy)}>{limitLabel(kit.lockLimitedBy)}</span> : null}
        </div>
      );
    },
  }) as ColumnDef<typeof features, KitSummary, number | null>;
}

function columnsFor(ctx: Ctx) {
  return helper.columns([
    helper.display({
      id: "select",
      enableSorting: false,
      enableHiding: false,
      header: () => <span className="sr-only">Pick to compare</span>,
      cell: ({ row }) => (
        <input
          type="checkbox"
          aria-label={`Pick ${row.original.name} to compare`}
          checked={row.getIsSelected()}
          disabled={!row.getCanSelect()}
          onChange={row.getToggleSelectedHandler()}
          className="size-4 accent-steel"
        />
      ),
    }),
    helper.accessor("name", {
      header: COLUMN_LABELS.name,
      enableHiding: false,
      cell: (info) => {
        const k = info.row.original;
        return (
          <div className="min-w-44">
            <Link href={`/workspaces/${ctx.workspaceId}/kits/${k.id}`} className="font-medium hover:text-steel hover:underline" data-testid="kit-name">{k.name}</Link>
            {k.archivedAt ? <span className="ml-1.5 rounded bg-ink/10 px-1 text-[11px] text-ink">archived</span> : null}
            {k.originRevision !== null ? (
              <p className="text-[11px] text-ink-muted">variant of {k.originKitName ? `“${k.originKitName}”` : "a deleted kit"}, revision {k.originRevision}</p>
            ) : null}
          </div>
        );
      },
    }),
    helper.accessor("scale", { header: COLUMN_LABELS.scale }),
    helper.accessor((k) => k.createdByName ?? "", { id: "author", header: COLUMN_LABELS.author, cell: (info) => info.getValue() || <span className="text-ink-muted">—</span> }),
    helper.accessor("updatedAt", {
      header: COLUMN_LABELS.updatedAt,
      cell: (info) => <time dateTime={info.getValue()} className="whitespace-nowrap">{dateFormat.format(new Date(info.getValue()))}</time>,
    }),
    helper.accessor("headRevision", { header: COLUMN_LABELS.headRevision, cell: (info) => <span className="tabular-nums">{info.getValue()}</span> }),
    helper.accessor((k) => k.tags.join(", "), {
      id: "tags",
      header: COLUMN_LABELS.tags,
      enableSorting: false,
      cell: (info) => (
        <ul className="flex flex-wrap gap-1" aria-label="Tags">
          {info.row.original.tags.map((t) => <li key={t} className="rounded bg-steel/10 px-1.5 text-[11px] text-steel">{t}</li>)}
        </ul>
      ),
    }),
    ...READOUT_KEYS.map((k) => readoutColumn(k, ctx)),
    helper.display({
      id: "actions",
      enableHiding: false,
      header: () => <span className="sr-only">Actions</span>,
      cell: ({ row }) => (ctx.canWrite ? <KitRowActions kit={row.original} workspaceId={ctx.workspaceId} /> : null),
    }),
  ]);
}

export interface LibraryTableProps {
  readonly workspaceId: string;
  readonly kits: KitSummary[];
  readonly targets: Targets;
  readonly canWrite: boolean;
  readonly sort: LibrarySort;
  readonly dir: "asc" | "desc";
  readonly columns: readonly LibraryColumn[];
  readonly selection: RowSelectionState;
  readonly onSort: (sort: LibrarySort, dir: "asc" | "desc") => void;
  readonly onSelection: (next: RowSelectionState) => void;
  readonly busy: boolean;
}

const resolve = <T,>(u: Updater<T>, cur: T): T => (typeof u === "function" ? (u as (c: T) => T)(cur) : u);

export function LibraryTable({ workspaceId, kits, targets, canWrite, sort, dir, columns, selection, onSort, onSelection, busy }: LibraryTableProps) {
  const defs = useMemo(() => columnsFor({ workspaceId, targets, canWrite }), [workspaceId, targets, canWrite]);
  const sorting: SortingState = useMemo(() => {
    const col = (Object.keys(SORT_OF) as LibraryColumn[]).find((c) => SORT_OF[c] === sort);
    return col ? [{ id: col, desc: dir === "desc" }] : [];
  }, [sort, dir]);
  const columnVisibility: ColumnVisibilityState = useMemo(() => Object.fromEntries(LIBRARY_COLUMNS.map((c) => [c, columns.includes(c)])), [columns]);
  const picked = Object.keys(selection).filter((id) => selection[id]).length;

  const table = useTable({
    features,
    columns: defs,
    data: kits,
    getRowId: (k) => k.id,
    manualSorting: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    // A fifth kit cannot be picked: a comparison takes at most four.
    enableRowSelection: (row) => row.getIsSelected() || picked < COMPARE_MAX,
    state: { sorting, columnVisibility, rowSelection: selection },
    onSortingChange: (u) => {
      const next = resolve(u, sorting)[0];
      const s = next ? SORT_OF[next.id as LibraryColumn] : undefined;
      if (next && s) onSort(s, next.desc ? "desc" : "asc");
    },
    onRowSelectionChange: (u) => onSelection(resolve(u, selection)),
  });

  return (
    <div className="overflow-x-auto rounded-lg border border-ink/10 bg-white">
      <table className="w-full text-sm" aria-label="Kits" aria-busy={busy || undefined} data-testid="library-table">
        <thead className="bg-ink/5 text-left text-xs text-ink-muted">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                const numeric = (READOUT_KEYS as readonly string[]).includes(header.column.id);
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}
                    className={`px-2.5 py-2 font-medium ${numeric ? "text-right" : ""}`}
                  >
                    {header.column.getCanSort() ? (
                      <button
                        type="button"
                        data-testid={`sort-${header.column.id}`}
                        onClick={() => header.column.toggleSorting(sorted ? sorted === "asc" : numeric || header.column.id === "updatedAt")}
                        className="inline-flex items-center gap-1 rounded hover:text-ink focus-visible:outline-2 focus-visible:outline-steel"
                      >
                        <table.FlexRender header={header} />
                        <span aria-hidden className="w-3 text-center">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                      </button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-ink/10">
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} data-kit-id={row.id} className={row.getIsSelected() ? "bg-steel/5" : undefined}>
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className={`px-2.5 py-2 align-top ${(READOUT_KEYS as readonly string[]).includes(cell.column.id) ? "text-right" : ""}`}>
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

