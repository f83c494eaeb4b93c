import { Box, Button, Field, Grid, HStack, IconButton, Input, NativeSelect, Stack, Text } from '@chakra-ui/react';
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
                    <NativeSelect.Root>
                      <NativeSelect.Field
                        value={row.figure}
                        onChange={(e) => void setFieldValue(`${prefix}.figure`, e.target.value)}
                        onBlur={() => void setFieldTouched(`${prefix}.figure`, true)}
                      >
                        <option value="">Choose a figure…</option>
                        {row.figure && !findFigure(row.figure) && <option value={row.figure}>{figureLabel(row.figure)}</option>}
                        {figuresBySection().map(({ section, figures }) => (
                          <optgroup key={section} label={section}>
                            {figures.map((figure) => (
                              <option key={figure.key} value={figure.key}>
                                {figure.label}
                                {figure.unit === 'percent' ? ' (%)' : ''}
                              </option>
                            ))}
                          </optgroup>
                        ))}
                      </NativeSelect.Field>
                      <NativeSelect.Indicator />
                    </NativeSelect.Root>
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
