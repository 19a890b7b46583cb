"use client";

import { useId } from "react";

import { Field, SelectField, type FieldProps, type SelectFieldProps } from "@/components/ui/field";

import { useFieldError } from "./action-form";

/** A Field that shows, beside itself, the error its ActionForm's last submission gave it. */
export function FormField(props: Omit<FieldProps, "error" | "errorId">) {
  return <Field {...props} error={useFieldError(props.name)} errorId={`${useId()}-error`} />;
}

/** A SelectField that shows, beside itself, the error its ActionForm's last submission gave it. */
export function FormSelectField(props: Omit<SelectFieldProps, "error" | "errorId"> & { name: string }) {
  return <SelectField {...props} error={useFieldError(props.name)} errorId={`${useId()}-error`} />;
}
