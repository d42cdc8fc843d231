import { useMemo, useRef, useState } from 'react';
import { useVirtualizer } from '@tanstack/react-virtual';
import { useTable, type ColumnFiltersState, type SortingState } from '@tanstack/react-table';
import type { DeskPassenger } from '@shared/schemas/flight-desk';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/page';
import { TextField } from '../../../components/ui/text-field';
import { filterChoices, matchesSearch, NO_FILTERS, type PassengerFilters } from '../model/passenger-filters';
import { passengerColumns, passengerTableFeatures } from './passenger-columns';
import { PassengerFilterBar } from './passenger-filter-bar';

const NO_PASSENGERS: DeskPassenger[] = [];

export function PassengerList({ passengers, timeZone, departureIso }: { passengers: DeskPassenger[] | undefined; timeZone: string; departureIso: string }) {
  const data = passengers ?? NO_PASSENGERS;
  const [filters, setFilters] = useState<PassengerFilters>(NO_FILTERS);
  const [search, setSearch] = useState('');
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const columns = useMemo(() => passengerColumns({ timeZone, departureIso }), [timeZone, departureIso]);
  const columnFilters = useMemo<ColumnFiltersState>(
    () => Object.entries(filters).filter(([, v]) => v !== 'all').map(([id, value]) => ({ id, value })),
    [filters],
  );
  const choices = useMemo(() => filterChoices(data), [data]);

  const table = useTable({
    features: passengerTableFeatures,
    columns,
    data,
    getRowId: (p) => String(p.id),
    state: { sorting, columnFilters, globalFilter: search },
    onSortingChange: setSorting,
    // The search looks at name and PNR together, so it is run once per row from the name column.
    globalFilterFn: (row, _id, value: string) => matchesSearch(row.original, value),
    getColumnCanGlobalFilter: (column) => column.id === 'name',
  });
  const rows = table.getRowModel().rows;
  // Only the rows in view (and a screenful either side) are in the page, so a wide-body's 850 passengers scroll as
  // lightly as 50; spacer rows keep the scrollbar true, and aria-rowcount/rowindex tell screen readers the whole size.
  const scroller = useRef<HTMLDivElement>(null);
  // The virtualizer re-renders this component itself on scroll; the compiler's memoizing is not needed here.
  // eslint-disable-next-line react-hooks/incompatible-library
  const virtualizer = useVirtualizer({ count: rows.length, getScrollElement: () => scroller.current, estimateSize: () => 48, overscan: 12 });
  const visible = virtualizer.getVirtualItems();
  const padTop = visible[0]?.start ?? 0;
  const padBottom = Math.max(0, virtualizer.getTotalSize() - (visible.at(-1)?.end ?? 0));
  const narrowed = columnFilters.length > 0 || search.trim() !== '';

  return (
    <Panel title="Passengers">
      <div className="mb-3 flex flex-wrap items-end gap-3">
        <TextField label="Search name, PNR or seat" value={search} onChange={setSearch} className="w-72" placeholder="e.g. Okafor, K7QX2M or 14C" type="search" />
        <PassengerFilterBar filters={filters} onChange={setFilters} cabins={choices.cabins} ssrCodes={choices.ssrCodes} />
        {narrowed && (
          <Button
            variant="quiet"
            onClick={() => {
              setFilters(NO_FILTERS);
              setSearch('');
            }}
          >
            Clear filters
          </Button>
        )}
      </div>
      <p className="mb-2 font-bold" role="status" aria-live="polite" data-testid="passenger-count">
        {passengers === undefined ? 'Loading passengers…' : narrowed ? `Showing ${rows.length} of ${data.length} passengers` : `${data.length} passengers`}
      </p>
      <div ref={scroller} className="max-h-[70vh] overflow-auto rounded-md border-2 border-line" data-testid="passenger-scroller">
        <table className="w-full text-base" aria-rowcount={rows.length + 1}>
          <caption className="sr-only">Passengers on this flight; the column buttons sort the list</caption>
          <thead className="sticky top-0 z-10 bg-harbour-soft">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id} aria-rowindex={1}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th key={header.id} scope="col" className="px-3 py-2 text-left" aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}>
                      <button type="button" className="font-bold underline-offset-2 hover:underline" onClick={header.column.getToggleSortingHandler()}>
                        <table.FlexRender header={header} />
                        <span aria-hidden>{sorted === 'asc' ? ' ▴' : sorted === 'desc' ? ' ▾' : ''}</span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {padTop > 0 && (
              <tr aria-hidden>
                <td colSpan={columns.length} style={{ height: padTop, padding: 0 }} />
              </tr>
            )}
            {visible.map((v) => {
              const row = rows[v.index]!;
              return (
                <tr
                  key={row.id} ref={virtualizer.measureElement} data-index={v.index} aria-rowindex={v.index + 2}
                  className={`border-t border-line align-top ${v.index % 2 === 0 ? 'bg-paper/40' : ''}`} data-pnr={row.original.pnr}
                >
                  {row.getAllCells().map((cell) => (
                    <td key={cell.id} className="px-3 py-2">
                      <table.FlexRender cell={cell} />
                    </td>
                  ))}
                </tr>
              );
            })}
            {padBottom > 0 && (
              <tr aria-hidden>
                <td colSpan={columns.length} style={{ height: padBottom, padding: 0 }} />
              </tr>
            )}
            {rows.length === 0 && passengers !== undefined && (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-lg">
                  No passenger matches these filters.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
    </Panel>
  );
}
