"use client";

import { Field, type FieldProps } from "@/components/ui/field";

import { useFieldError } from "./action-form";

/** A Field that shows the error its ActionForm's last submission gave it. */
export function FormField(props: Omit<FieldProps, "error">) {
  return <Field {...props} error={useFieldError(props.name)} />;
}
