import type { ReactNode } from 'react';

/**
 * A plain list table: a scrolling frame, a caption for screen readers, one header cell per column
 * and a last header cell, hidden from sight, for the row's actions. The rows come as children.
 */
export function ListTable({ caption, columns, children }: { caption: string; columns: string[]; children: ReactNode }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-abyss/10 bg-white">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-foam">
          <tr>
            {columns.map((column) => (
              <th key={column} scope="col" className="px-3 py-2 font-semibold">
                {column}
              </th>
            ))}
            <th scope="col" className="px-3 py-2 font-semibold">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
