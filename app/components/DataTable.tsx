// One look for the app's plain tables of records (admin lists, catalogues, materials): a header
// row, a row header per record, numbers right-aligned, and a box that scrolls sideways on a
// narrow screen so the page itself never does.
import type { ReactNode } from "react";
import { Form, Link } from "react-router";
import { Button } from "~/components/ui";

/**
 * The box every wide table sits in. `relative` matters: a visually hidden label (`sr-only`, an
 * absolutely placed 1 px box) inside a scroller that is not itself positioned takes its place
 * from an ancestor outside the scroller, escapes its clip, and widens the whole page.
 */
export function TableScroll({ children, className = "" }: { children: ReactNode; className?: string }) {
  return <div className={`relative max-w-full overflow-x-auto ${className}`}>{children}</div>;
}

export interface Column<T> {
  /** stable key of the column */
  key: string;
  header: ReactNode;
  cell: (row: T) => ReactNode;
  /** right-aligned, tabular figures, never wrapped */
  numeric?: boolean;
  /** the cell names the row (a `th scope="row"`); one column per table */
  rowHeader?: boolean;
  /** extra classes on this column's cells */
  className?: string;
}

export function DataTable<T>({
  columns,
  rows,
  rowKey,
  caption,
  highlighted,
  testId,
  scrollClassName,
  stickyHead = false,
}: {
  columns: Column<T>[];
  rows: T[];
  rowKey: (row: T) => string | number;
  /** read by screen readers; the visible heading is the section's */
  caption?: string;
  /** the row being edited or viewed */
  highlighted?: (row: T) => boolean;
  testId?: string;
  /** e.g. a height limit for a long list (the header then stays in view) */
  scrollClassName?: string;
  stickyHead?: boolean;
}) {
  const align = (c: Column<T>) => (c.numeric ? "whitespace-nowrap text-right tabular-nums" : "");
  return (
    <TableScroll className={scrollClassName}>
      <table className="min-w-full text-left text-sm" data-testid={testId}>
        {caption ? <caption className="sr-only">{caption}</caption> : null}
        <thead className={`border-b border-ink/20 ${stickyHead ? "sticky top-0 bg-white" : ""}`}>
          <tr>
            {columns.map((c) => (
              <th key={c.key} scope="col" className={`px-2 py-2 ${c.numeric ? "text-right" : ""}`}>
                {c.header}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={rowKey(row)} className={`border-b border-ink/10 align-top ${highlighted?.(row) ? "bg-teal-50" : ""}`}>
              {columns.map((c) =>
                c.rowHeader ? (
                  <th key={c.key} scope="row" className={`px-2 py-2 font-semibold ${align(c)} ${c.className ?? ""}`}>
                    {c.cell(row)}
                  </th>
                ) : (
                  <td key={c.key} className={`px-2 py-2 ${align(c)} ${c.className ?? ""}`}>
                    {c.cell(row)}
                  </td>
                ),
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </TableScroll>
  );
}

/** A record's two actions in a list: open it (edit, view) and delete it (a post with intent=delete and its id). */
export function RowActions({ to, label, accessibleLabel, deleteId, deleteLabel }: { to: string; label: string; accessibleLabel: string; deleteId: number; deleteLabel: string }) {
  return (
    <div className="flex items-center gap-2">
      <Link to={to} className="rounded-md border border-ink/30 bg-white px-3 py-1.5 text-sm font-semibold hover:bg-ink/5" aria-label={accessibleLabel}>
        {label}
      </Link>
      <Form method="post">
        <input type="hidden" name="intent" value="delete" />
        <input type="hidden" name="id" value={deleteId} />
        <Button variant="danger" aria-label={deleteLabel}>
          Delete
        </Button>
      </Form>
    </div>
  );
}
