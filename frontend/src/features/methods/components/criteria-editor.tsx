import { Box, Button, Field, Grid, HStack, IconButton, Input, Stack, Text } from '@chakra-ui/react';
import { CRITERION_OPS, figuresBySection, findFigure, type CriterionOp } from '@meritline/shared';
import { FieldArray, getIn, useFormikContext } from 'formik';
import { figureLabel } from '@/components/study-results';
import { SelectControl } from '@/components/select-control';
import { criterionRowInWords as rowInWords, type CriterionRow } from '../api/version-rules';

const OP_LABELS: Record<CriterionOp, string> = {
  '>=': 'at least',
  '<=': 'at most',
  '>': 'above',
  '<': 'below',
  between: 'from … to',
  'abs<=': 'within ± (absolute value at most)',
};

const FIGURE_GROUPS = figuresBySection().map(({ section, figures }) => ({
  label: section,
  options: figures.map((figure) => ({ value: figure.key, label: `${figure.label}${figure.unit === 'percent' ? ' (%)' : ''}` })),
}));

/** The catalogue's figures by section, after a saved figure the catalogue no longer has. */
const figureChoices = (chosen: string) =>
  chosen && !findFigure(chosen) ? [{ value: chosen, label: figureLabel(chosen) }, ...FIGURE_GROUPS] : FIGURE_GROUPS;

const NEW_ROW: CriterionRow = { figure: '', label: '', op: '>=', value: '', high: '' };

/** The acceptance criteria of a version as editable rows: a figure from the catalogue, a comparison and limit(s); the words follow from them. */
export function CriteriaEditor({ name = 'criteria' }: { name?: string }) {
  const { values, errors, touched, submitCount, setFieldValue, setFieldTouched } = useFormikContext<Record<string, unknown>>();
  const rows = (getIn(values, name) as CriterionRow[]) ?? [];
  const errorAt = (i: number, key: keyof CriterionRow): string | undefined => {
    const error = getIn(errors, `${name}.${i}.${key}`);
    const shown = submitCount > 0 || getIn(touched, `${name}.${i}.${key}`);
    return shown && typeof error === 'string' ? error : undefined;
  };

  return (
    <FieldArray name={name}>
      {({ push, remove }) => (
        <Stack gap="3">
          {rows.length === 0 && (
            <Text color="fg.muted" fontSize="sm">
              No criteria yet. Studies on this version will show every figure but no verdict.
            </Text>
          )}
          {rows.map((row, i) => {
            const prefix = `${name}.${i}`;
            return (
              <Box key={i} borderWidth="1px" borderColor="border" borderRadius="l2" p="3" role="group" aria-label={`Criterion ${i + 1}`}>
                <Grid templateColumns={{ base: 'minmax(0, 1fr)', md: 'repeat(8, minmax(0, 1fr))' }} gap="3" alignItems="start">
                  <Field.Root invalid={Boolean(errorAt(i, 'figure'))} gridColumn={{ md: 'span 8' }}>
                    <Field.Label>Figure</Field.Label>
                    <SelectControl
                      value={row.figure}
                      onChange={(value) => void setFieldValue(`${prefix}.figure`, value)}
                      onBlur={() => void setFieldTouched(`${prefix}.figure`, true)}
                      placeholder="Choose a figure…"
                      options={figureChoices(row.figure)}
                    />
                    {errorAt(i, 'figure') ? (
                      <Field.ErrorText>{errorAt(i, 'figure')}</Field.ErrorText>
                    ) : (
                      row.figure && <Field.HelperText data-testid={`criterion-${i + 1}-words`}>{rowInWords(row)}</Field.HelperText>
                    )}
                  </Field.Root>
                  <Field.Root gridColumn={{ md: 'span 3' }}>
                    <Field.Label>Comparison</Field.Label>
                    <SelectControl
                      value={row.op}
                      onChange={(value) => void setFieldValue(`${prefix}.op`, value)}
                      options={CRITERION_OPS.map((op) => ({ value: op, label: OP_LABELS[op] }))}
                    />
                  </Field.Root>
                  <Field.Root invalid={Boolean(errorAt(i, 'value'))} gridColumn={{ md: 'span 2' }}>
                    <Field.Label>{row.op === 'between' ? 'From' : 'Limit'}</Field.Label>
                    <Input
                      inputMode="decimal"
                      value={row.value}
                      onChange={(e) => void setFieldValue(`${prefix}.value`, e.target.value)}
                      onBlur={() => void setFieldTouched(`${prefix}.value`, true)}
                    />
                    {errorAt(i, 'value') && <Field.ErrorText>{errorAt(i, 'value')}</Field.ErrorText>}
                  </Field.Root>
                  {row.op === 'between' ? (
                    <Field.Root invalid={Boolean(errorAt(i, 'high'))} gridColumn={{ md: 'span 2' }}>
                      <Field.Label>To</Field.Label>
                      <Input
                        inputMode="decimal"
                        value={row.high}
                        onChange={(e) => void setFieldValue(`${prefix}.high`, e.target.value)}
                        onBlur={() => void setFieldTouched(`${prefix}.high`, true)}
                      />
                      {errorAt(i, 'high') && <Field.ErrorText>{errorAt(i, 'high')}</Field.ErrorText>}
                    </Field.Root>
                  ) : (
                    <Box display={{ base: 'none', md: 'block' }} gridColumn={{ md: 'span 2' }} />
                  )}
                  <HStack pt={{ base: '0', md: '6' }} justify="flex-end">
                    <IconButton
                      size="sm"
                      variant="ghost"
                      colorPalette="red"
                      aria-label={`Remove criterion ${i + 1}`}
                      onClick={() => remove(i)}
                    >
                      ×
                    </IconButton>
                  </HStack>
                </Grid>
              </Box>
            );
          })}
          <Box>
            <Button size="sm" variant="outline" onClick={() => push({ ...NEW_ROW })}>
              Add a criterion
            </Button>
          </Box>
        </Stack>
      )}
    </FieldArray>
  );
}
