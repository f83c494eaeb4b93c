import { NativeSelect } from '@chakra-ui/react';
import type { FocusEventHandler, ReactNode } from 'react';

export interface SelectOption {
  value: string;
  label: ReactNode;
}

/** Options under a heading of the list, e.g. the versions of one method. */
export interface SelectOptionGroup {
  label: string;
  options: readonly SelectOption[];
}

export interface SelectControlProps {
  name?: string;
  value: string;
  onChange: (value: string) => void;
  onBlur?: FocusEventHandler<HTMLSelectElement>;
  options: readonly (SelectOption | SelectOptionGroup)[];
  /** The first choice, with the empty value: "any", "none" or a prompt to choose. */
  placeholder?: string;
  size?: 'sm' | 'md';
  disabled?: boolean;
  invalid?: boolean;
  /** Where no field label names the list. */
  'aria-label'?: string;
}

const renderOption = (option: SelectOption) => (
  <option key={option.value} value={option.value}>
    {option.label}
  </option>
);

/** The browser's own drop-down list, for a choice among a few values. */
export function SelectControl({
  name,
  value,
  onChange,
  onBlur,
  options,
  placeholder,
  size,
  disabled,
  invalid,
  'aria-label': ariaLabel,
}: SelectControlProps) {
  return (
    <NativeSelect.Root size={size} disabled={disabled} invalid={invalid}>
      <NativeSelect.Field
        name={name}
        value={value}
        onChange={(event) => onChange(event.currentTarget.value)}
        onBlur={onBlur}
        aria-label={ariaLabel}
      >
        {placeholder !== undefined && <option value="">{placeholder}</option>}
        {options.map((item, index) =>
          'options' in item ? (
            <optgroup key={`group:${index}`} label={item.label}>
              {item.options.map(renderOption)}
            </optgroup>
          ) : (
            renderOption(item)
          ),
        )}
      </NativeSelect.Field>
      <NativeSelect.Indicator />
    </NativeSelect.Root>
  );
}
