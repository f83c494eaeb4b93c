import { HStack, Stack, Text } from '@chakra-ui/react';
import { findFigure } from '@meritline/shared';
import { FailsIcon, MeetsIcon, NotJudgedIcon } from './icons';

export interface CriterionMarkProps {
  /** true: meets the criterion; false: does not; null: not judged. */
  pass: boolean | null;
  /** Words for a failure without a value, e.g. "Not computed". */
  missingValue?: boolean;
}

/** Pass or fail in words and a shape, never colour alone. */
export function CriterionMark({ pass, missingValue = false }: CriterionMarkProps) {
  const [label, color, Icon] =
    pass === true
      ? (['Meets', 'green.fg', MeetsIcon] as const)
      : pass === false
        ? ([missingValue ? 'Fails: not computed' : 'Does not meet', 'red.fg', FailsIcon] as const)
        : (['Not judged', 'fg.muted', NotJudgedIcon] as const);
  return (
    <HStack
      as="span"
      gap="1.5"
      color={color}
      fontWeight={pass === null ? '400' : '600'}
      whiteSpace="nowrap"
      data-outcome={pass === null ? 'none' : pass ? 'pass' : 'fail'}
    >
      <Icon />
      <Text as="span">{label}</Text>
    </HStack>
  );
}

/** A criterion's name, with the part of the study its figure belongs to beneath. */
export function CriterionName({ name, figure }: { name: string; figure: string }) {
  return (
    <Stack gap="0">
      <Text fontWeight="500">{name}</Text>
      <Text fontSize="xs" color="fg.muted">
        {findFigure(figure)?.section ?? 'Other figure'}
      </Text>
    </Stack>
  );
}
