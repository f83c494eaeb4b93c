import { SegmentGroup } from '@chakra-ui/react';

export type FillMode = 'replace' | 'append';

/** When the grid already holds rows: replace them with the new ones, or keep them and add the new ones after. */
export function FillModeChoice({
  value,
  onChange,
  appendLabel,
}: {
  value: FillMode;
  onChange: (mode: FillMode) => void;
  appendLabel: string;
}) {
  return (
    <SegmentGroup.Root value={value} onValueChange={(e) => onChange(e.value as FillMode)} size="sm">
      <SegmentGroup.Indicator />
      <SegmentGroup.Items
        items={[
          { value: 'replace', label: 'Replace the rows in the grid' },
          { value: 'append', label: appendLabel },
        ]}
      />
    </SegmentGroup.Root>
  );
}
