"use client";

import type { ReactNode } from "react";
import { Field, Input, Select } from "@/components/ui";

/** A number field: typed as text (decimal keypad on phones), checked by the API, its error beside it. */
export function NumberField({
  label,
  unit,
  hint,
  value,
  onChange,
  error,
  required = false,
  name,
  className,
}: {
  label: string;
  unit?: string;
  hint?: ReactNode;
  value: string;
  onChange: (value: string) => void;
  error?: string;
  required?: boolean;
  /** The API field this control fills (a dotted path), for tests and autofill. */
  name: string;
  className?: string;
}) {
  return (
    <Field label={unit ? `${label} (${unit})` : label} hint={hint} error={error} required={required} className={className}>
      <Input
        name={name}
        inputMode="decimal"
        autoComplete="off"
        value={value}
        onChange={(e) => onChange(e.target.value)}
        className="text-right tabular-nums"
      />
    </Field>
  );
}

export function TextField({
  label,
  hint,
  value,
  onChange,
  error,
  required = false,
  name,
  placeholder,
  className,
}: {
  label: string;
  hint?: ReactNode;
  value: string;
  onChange: (value: string) => void;
  error?: string;
  required?: boolean;
  name: string;
  placeholder?: string;
  className?: string;
}) {
  return (
    <Field label={label} hint={hint} error={error} required={required} className={className}>
      <Input name={name} autoComplete="off" value={value} placeholder={placeholder} onChange={(e) => onChange(e.target.value)} />
    </Field>
  );
}

export function ChoiceField<T extends string>({
  label,
  hint,
  value,
  onChange,
  options,
  error,
  name,
  className,
}: {
  label: string;
  hint?: ReactNode;
  value: T;
  onChange: (value: T) => void;
  options: ReadonlyArray<{ value: T; label: string }>;
  error?: string;
  name: string;
  className?: string;
}) {
  return (
    <Field label={label} hint={hint} error={error} className={className}>
      <Select name={name} value={value} onChange={(e) => onChange(e.target.value as T)}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </Select>
    </Field>
  );
}
