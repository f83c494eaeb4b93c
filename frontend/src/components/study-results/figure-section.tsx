import { Heading, HStack, Stack, Text } from '@chakra-ui/react';
import type { EvaluationResult, EvaluationWarning } from '@meritline/shared';
import type { ReactNode } from 'react';
import { NoteIcon } from './icons';

export interface FigureSectionProps {
  id: string;
  title: string;
  description?: ReactNode;
  /** Engine sections whose warnings explain a missing result. */
  sections: readonly string[];
  result: EvaluationResult;
  /** Null when the engine could not compute this section. */
  available: boolean;
  children?: ReactNode;
}

const sentence = (text: string) => text.charAt(0).toUpperCase() + text.slice(1).replace(/([^.])$/, '$1.');

const APPROACH_WORDS: [RegExp, string][] = [
  [/\bsdResidual\b/g, 'the residual-SD limits'],
  [/\bsdIntercept\b/g, 'the intercept-SD limits'],
  [/\biso11843\b/g, 'ISO 11843-2'],
  [/\bhubauxVos\b/g, 'Hubaux–Vos'],
];

/** The engine's notes in the words of the screen; the few that name result fields are reworded. */
export function plainWarning(warning: EvaluationWarning): string {
  if (warning.section === 'range' && warning.code === 'no_criteria') {
    return 'The method version states no criterion that applies level by level (back-calculated deviation, RSD or recovery at each level), so no working range is derived.';
  }
  if (warning.section === 'range' && warning.code === 'no_level_passes')
    return 'The level-by-level criteria hold at no level, so there is no working range.';
  return sentence(APPROACH_WORDS.reduce((text, [pattern, words]) => text.replace(pattern, words), warning.message));
}

export function FigureSection({ id, title, description, sections, result, available, children }: FigureSectionProps) {
  const notes = result.warnings.filter((w) => sections.includes(w.section));
  return (
    <Stack as="section" gap="3" aria-labelledby={`${id}-title`}>
      <Stack gap="1">
        <Heading as="h3" size="md" id={`${id}-title`}>
          {title}
        </Heading>
        {description && (
          <Text color="fg.muted" fontSize="sm">
            {description}
          </Text>
        )}
      </Stack>
      {available ? children : notes.length === 0 && <NotComputed text="Not computed: the study holds no data for this part." />}
      {notes.map((note, i) => (
        <NotComputed key={i} text={plainWarning(note)} />
      ))}
    </Stack>
  );
}

function NotComputed({ text }: { text: string }) {
  return (
    <HStack gap="2" color="fg.muted" fontSize="sm" align="flex-start">
      <Text as="span" mt="0.5">
        <NoteIcon />
      </Text>
      <Text>{text}</Text>
    </HStack>
  );
}
