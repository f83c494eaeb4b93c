import { Alert, Box, Heading, List, Skeleton, Stack, Table, Text } from '@chakra-ui/react';
import { formatSignificant } from '@meritline/shared';
import { useQuery } from '@tanstack/react-query';
import { useFormikContext } from 'formik';
import { isApiError } from '@/lib/api-client';
import { previewRequest, type PreparationValues } from '../api/preparation-form';
import { preparationsQueries } from '../api/preparations-queries';
import { useDebouncedValue } from '../hooks/use-debounced-value';
import { BudgetTable } from './budget-table';
import { concentrationWords } from './concentration-words';

function usePreview() {
  const { values } = useFormikContext<PreparationValues>();
  const body = useDebouncedValue(previewRequest(values), 300);
  return { body, preview: useQuery(preparationsQueries.preview(body)), massUnit: String(values.stock.massUnit) };
}

/** The stock's budget under the form, where the table has room; it follows the same dry run. */
export function PreparationBudget() {
  const { preview, massUnit } = usePreview();
  if (!preview.data || preview.isError) return null;
  return (
    <Box borderWidth="1px" borderRadius="l3" p="5" bg="bg.panel" opacity={preview.isPlaceholderData ? 0.6 : 1}>
      <Heading as="h2" size="md" mb="3">
        Uncertainty budget of the stock
      </Heading>
      <BudgetTable stock={preview.data.stock} massUnit={massUnit} />
      <Text fontSize="xs" color="fg.muted" mt="3">
        c = 1000 · m · P / V; relative standard uncertainties combined in quadrature (GUM). A tolerance ± a counts as a/√3 when taken as
        rectangular and a/√6 when triangular. State an expanded uncertainty U = k · u as your procedures require.
      </Text>
    </Box>
  );
}

/** The server's dry run of what is on the form, as the analyst types. */
export function PreparationPreview() {
  const { body, preview } = usePreview();

  if (!body)
    return (
      <Text color="fg.muted" aria-live="polite">
        Choose the material and fill in the stock and each dilution to see the concentrations and their uncertainties.
      </Text>
    );
  if (preview.isError) {
    const errors = isApiError(preview.error) ? (preview.error.body.errors ?? []) : [];
    return (
      <Alert.Root status="error" role="alert">
        <Alert.Indicator />
        <Alert.Content>
          <Alert.Title>{isApiError(preview.error) ? preview.error.body.message : 'The preview could not be calculated.'}</Alert.Title>
          <Alert.Description>
            <List.Root ps="4">
              {errors.map((e) => (
                <List.Item key={e.field + e.code}>{e.message}</List.Item>
              ))}
            </List.Root>
          </Alert.Description>
        </Alert.Content>
      </Alert.Root>
    );
  }
  if (!preview.data) return <Skeleton height="40" />;
  const { stock, steps } = preview.data;
  return (
    <Stack gap="5" aria-live="polite" opacity={preview.isPlaceholderData ? 0.6 : 1}>
      <Box>
        <Heading as="h3" size="sm" mb="2">
          Working standards
        </Heading>
        <Table.Root size="sm" aria-label="Concentrations of the solutions">
          <Table.Header>
            <Table.Row>
              <Table.ColumnHeader>Solution</Table.ColumnHeader>
              <Table.ColumnHeader textAlign="end">Concentration and standard uncertainty</Table.ColumnHeader>
              <Table.ColumnHeader textAlign="end">u relative</Table.ColumnHeader>
            </Table.Row>
          </Table.Header>
          <Table.Body>
            <Table.Row fontWeight="600">
              <Table.Cell>Stock</Table.Cell>
              <Table.Cell textAlign="end">{concentrationWords(stock.concentration, stock.u, stock.unit)}</Table.Cell>
              <Table.Cell textAlign="end">{formatSignificant(stock.relativeU * 100, 2)} %</Table.Cell>
            </Table.Row>
            {steps.map((s, i) => (
              <Table.Row key={i}>
                <Table.Cell>Dilution {i + 1}</Table.Cell>
                <Table.Cell textAlign="end">{concentrationWords(s.concentration, s.u, stock.unit)}</Table.Cell>
                <Table.Cell textAlign="end">{formatSignificant(s.relativeU * 100, 2)} %</Table.Cell>
              </Table.Row>
            ))}
          </Table.Body>
        </Table.Root>
      </Box>
    </Stack>
  );
}
