import { screen, within } from '@testing-library/react';
import { Formik } from 'formik';
import { CriteriaEditor } from '@/features/methods/components/criteria-editor';
import { CriteriaList } from '@/features/methods/components/criteria-list';
import { fromCriterionRows, type CriterionRow } from '@/features/methods/api/version-rules';
import { renderWithProviders } from './render';

function Editor({ onValues }: { onValues: (rows: CriterionRow[]) => void }) {
  return (
    <Formik initialValues={{ criteria: [] as CriterionRow[] }} onSubmit={() => {}}>
      {({ values }) => {
        onValues(values.criteria);
        return <CriteriaEditor />;
      }}
    </Formik>
  );
}

describe('criteria editor', () => {
  it('offers figures by name and writes the words from the figure, comparison and limit', async () => {
    let rows: CriterionRow[] = [];
    const { user } = renderWithProviders(<Editor onValues={(v) => (rows = v)} />);
    await user.click(await screen.findByRole('button', { name: 'Add a criterion' }));
    const criterion = screen.getByRole('group', { name: 'Criterion 1' });
    const figure = within(criterion).getByLabelText('Figure');
    // Every option is words, never a path into the result.
    for (const option of within(figure).getAllByRole('option')) expect(option.textContent).not.toMatch(/[a-z]\.[a-z]/);

    await user.selectOptions(figure, 'Repeatability RSD (%)');
    await user.selectOptions(within(criterion).getByLabelText('Comparison'), 'at most');
    await user.type(within(criterion).getByLabelText('Limit'), '2');
    expect(screen.getByTestId('criterion-1-words')).toHaveTextContent('Repeatability RSD at most 2 %');
    expect(fromCriterionRows(rows)).toEqual([{ figure: 'precision.rsdR', op: '<=', value: 2, label: 'Repeatability RSD at most 2 %' }]);
  });

  it('lists criteria by their words and section, not by their path', async () => {
    renderWithProviders(
      <CriteriaList
        label="Acceptance criteria"
        criteria={[
          { figure: 'calibration.r2', op: '>=', value: 0.999, label: 'R² at least 0.99' },
          { figure: 'interceptTest.interceptPctOfTopResponse', op: 'abs<=', value: 2 },
        ]}
      />,
    );
    const table = await screen.findByRole('table', { name: 'Acceptance criteria' });
    expect(table).toHaveTextContent('Coefficient of determination R²');
    expect(table).toHaveTextContent('at least 0.999');
    expect(table).not.toHaveTextContent('R² at least 0.99');
    expect(table).toHaveTextContent('Intercept as % of the top response');
    expect(table).toHaveTextContent('within ± 2 %');
    expect(table).not.toHaveTextContent(/calibration\.r2|abs<=|interceptTest/);
  });
});
