import type { ReactNode } from 'react';

/**
 * The drawing of a chart, hidden from screen readers and from the keyboard alike: `inert` takes every element inside
 * (the chart library makes its surface and tooltips focusable) out of the Tab order, so nothing focusable sits under
 * `aria-hidden`. The figures themselves are given in words or in a `ChartTable` beside it.
 */
export function ChartFrame({ children, testId }: { children: ReactNode; testId?: string }) {
  return (
    <div aria-hidden inert data-testid={testId}>
      {children}
    </div>
  );
}

/** A chart's figures as a table, folded under the chart: the same data for screen readers and for careful reading. */
export function ChartTable({ summary, caption, columns, rows }: { summary: string; caption: string; columns: string[]; rows: ReactNode[][] }) {
  return (
    <details className="mt-2">
      <summary className="inline-flex min-h-6 cursor-pointer items-center font-bold text-harbour">{summary}</summary>
      <div className="mt-2 max-h-64 overflow-auto" tabIndex={0} role="region" aria-label={caption}>
        <table className="w-full text-left tabular-nums">
          <caption className="sr-only">{caption}</caption>
          <thead>
            <tr>
              {columns.map((c) => (
                <th key={c} scope="col" className="border-b-2 border-line px-2 py-1">
                  {c}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={i} className="border-b border-line">
                {r.map((cell, j) =>
                  j === 0 ? (
                    <th key={j} scope="row" className="px-2 py-1 font-normal">
                      {cell}
                    </th>
                  ) : (
                    <td key={j} className="px-2 py-1">
                      {cell}
                    </td>
                  ),
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
