import { Heading, HStack, Stack, Text } from '@chakra-ui/react';
import type { EvaluationResult } from '@meritline/shared';
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
        <NotComputed key={i} text={sentence(note.message)} />
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
