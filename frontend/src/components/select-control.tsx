import { NativeSelect } from '@chakra-ui/react';
import type { ReactNode } from 'react';

export interface SelectOption {
  value: string;
  label: ReactNode;
}

export interface SelectControlProps {
  value: string;
  onChange: (value: string) => void;
  options: readonly SelectOption[];
  /** The first choice, with the empty value: "any", "none" or a prompt to choose. */
  placeholder?: string;
  size?: 'sm' | 'md';
  disabled?: boolean;
  invalid?: boolean;
  /** Where no field label names the list. */
  'aria-label'?: string;
}

/** The browser's own drop-down list, for a choice among a few values. */
export function SelectControl({
  value,
  onChange,
  options,
  placeholder,
  size,
  disabled,
  invalid,
  'aria-label': ariaLabel,
}: SelectControlProps) {
  return (
    <NativeSelect.Root size={size} disabled={disabled} invalid={invalid}>
      <NativeSelect.Field value={value} onChange={(event) => onChange(event.currentTarget.value)} aria-label={ariaLabel}>
        {placeholder !== undefined && <option value="">{placeholder}</option>}
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </NativeSelect.Field>
      <NativeSelect.Indicator />
    </NativeSelect.Root>
  );
}
