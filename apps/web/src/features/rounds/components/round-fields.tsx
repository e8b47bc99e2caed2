import { FormikInputField, FormikSelectField } from '@roundbook/ui';
import { createContext, useContext } from 'react';
import type { ReactElement } from 'react';

/** What every field of the Round editor needs to know: may it be changed, and what did the server say. */
export interface RoundEditState {
  readOnly: boolean;
  /** Messages from the server (save or submit), by API field name. */
  serverErrors: Record<string, string>;
}

export const RoundEditContext = createContext<RoundEditState>({ readOnly: true, serverErrors: {} });

export function useRoundEdit(): RoundEditState {
  return useContext(RoundEditContext);
}

interface BaseProps {
  name: string;
  label: string;
  hint?: string | ReactElement;
  /** API field name whose server message shows here (defaults to `name`). */
  apiName?: string;
  /** A warning shown under the field when there is no error. */
  warning?: string | null;
}

export interface NumberFieldProps extends BaseProps {
  unit?: string;
  /** Text fields for chainages accept 1+250.0; numbers get the numeric keypad. */
  inputMode?: 'decimal' | 'numeric' | 'text';
  onValueChange?: (value: string) => void;
}

/** A number typed on the numeric keypad, kept as typed; large for gloved hands (the packages/ui adapter). */
export function NumberField({
  name,
  label,
  hint,
  apiName,
  warning,
  unit,
  inputMode = 'decimal',
  onValueChange,
}: NumberFieldProps) {
  const { readOnly, serverErrors } = useRoundEdit();
  return (
    <FormikInputField
      name={name}
      label={label}
      hint={hint}
      inputMode={inputMode}
      autoComplete="off"
      readOnly={readOnly}
      contentAfter={unit}
      message={serverErrors[apiName ?? name]}
      warning={warning}
      onValueChange={onValueChange}
    />
  );
}

/** A line (or several) of text: the packages/ui adapter, read only while the round is. */
export function TextField({
  name,
  label,
  hint,
  apiName,
  warning,
  multiline,
}: BaseProps & { multiline?: boolean }) {
  const { readOnly, serverErrors } = useRoundEdit();
  return (
    <FormikInputField
      name={name}
      label={label}
      hint={hint}
      readOnly={readOnly}
      message={serverErrors[apiName ?? name]}
      warning={warning}
      multiline={multiline}
    />
  );
}

export interface ChoiceFieldProps {
  name: string;
  label: string;
  hint?: string | ReactElement;
  options: readonly { value: string; label: string }[];
  /** Shown as the first, empty choice. */
  placeholder?: string;
  onValueChange?: (value: string) => void;
}

/** A choice from a list: the packages/ui Formik adapter, shut while the round is read only. */
export function ChoiceField({ name, label, hint, options, placeholder, onValueChange }: ChoiceFieldProps) {
  const { readOnly } = useRoundEdit();
  const choices = placeholder === undefined ? options : [{ value: '', label: placeholder }, ...options];
  return (
    <FormikSelectField
      name={name}
      label={label}
      hint={hint}
      options={choices}
      disabled={readOnly}
      onValueChange={onValueChange}
    />
  );
}
