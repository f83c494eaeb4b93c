import { useQuery } from '@tanstack/react-query';
import { screen, within } from '@testing-library/react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { renderWithProviders } from './render';

// An invented calibration series: standard level and instrument response.
interface Standard {
  id: string;
  level: string;
  response: number;
}

const column = dataTableColumns<Standard>();
const columns = column.columns([
  column.accessor('level', { header: 'Level', sortFn: 'alphanumeric' }),
  column.accessor('response', { header: 'Response', meta: { align: 'end' } }),
]);

const standards: Standard[] = [
  { id: 's3', level: 'Level 3', response: 3120 },
  { id: 's1', level: 'Level 1', response: 1012 },
  { id: 's2', level: 'Level 2', response: 2071 },
];

const bodyRows = () =>
  within(screen.getByRole('table', { name: 'Standards' }))
    .getAllByRole('row')
    .slice(1);
const firstCells = () => bodyRows().map((row) => within(row).getAllByRole('cell')[0]?.textContent);

describe('DataTable', () => {
  it('takes its rows from a query, shows a failed first load in place of the table and loads again on request', async () => {
    let calls = 0;
    function StandardsTable() {
      const query = useQuery({
        queryKey: ['standards'],
        queryFn: () => {
          calls += 1;
          return calls === 1 ? Promise.reject(new Error('offline')) : Promise.resolve(standards);
        },
      });
      return <DataTable label="Standards" columns={columns} query={query} />;
    }
    const { user } = renderWithProviders(<StandardsTable />);

    expect(await screen.findByRole('alert')).toHaveTextContent('The data could not be loaded');
    expect(screen.queryByRole('table')).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Try again' }));
    expect(await screen.findByRole('table', { name: 'Standards' })).toBeInTheDocument();
    expect(firstCells()).toEqual(['Level 3', 'Level 1', 'Level 2']);
  });

  it('sorts by a column when its header is clicked, and says so to assistive technology', async () => {
    const { user } = renderWithProviders(<DataTable label="Standards" columns={columns} data={standards} sortable />);

    expect(firstCells()).toEqual(['Level 3', 'Level 1', 'Level 2']);
    await user.click(screen.getByRole('button', { name: /Level/ }));
    expect(firstCells()).toEqual(['Level 1', 'Level 2', 'Level 3']);
    expect(screen.getByRole('columnheader', { name: /Level/ })).toHaveAttribute('aria-sort', 'ascending');
    await user.click(screen.getByRole('button', { name: /Level/ }));
    expect(firstCells()).toEqual(['Level 3', 'Level 2', 'Level 1']);
  });

  it('pages through the rows in the browser', async () => {
    const { user } = renderWithProviders(
      <DataTable
        label="Standards"
        columns={columns}
        data={standards}
        pageSize={2}
        sortable
        initialSorting={[{ id: 'level', desc: false }]}
      />,
    );

    expect(firstCells()).toEqual(['Level 1', 'Level 2']);
    expect(screen.getByText('Rows 1–2 of 3')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Next' }));
    expect(firstCells()).toEqual(['Level 3']);
    expect(screen.getByRole('button', { name: 'Next' })).toBeDisabled();
  });

  it('explains an empty table instead of showing nothing', () => {
    renderWithProviders(
      <DataTable label="Standards" columns={columns} data={[]} emptyTitle="No standards yet" emptyDescription="Add the first level." />,
    );
    expect(screen.getByText('No standards yet')).toBeInTheDocument();
    expect(screen.getByText('Add the first level.')).toBeInTheDocument();
  });
});
