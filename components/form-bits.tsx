"use client";

import type { ReactNode } from "react";
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { DialogCancel } from "@/components/dialog";
import { ApiClientError } from "@/lib/client/fetch-json";

export function FieldError({ id, message }: { id?: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="mt-1 text-sm text-decline">
      {message}
    </p>
  );
}

export function FormAlert({ message }: { message: string | null }) {
  if (!message) return null;
  return (
    <p role="alert" className="rounded-md border border-decline bg-decline-soft px-3 py-2 text-sm">
      {message}
    </p>
  );
}

/** A label above its control (give the control the same `id`), and the field's error below it. */
export function Field({
  id,
  label,
  error,
  className,
  children,
}: {
  id: string;
  label: ReactNode;
  error?: string;
  className?: string;
  children: ReactNode;
}) {
  return (
    <div className={className}>
      <label htmlFor={id} className="label">
        {label}
      </label>
      {children}
      <FieldError id={`${id}-error`} message={error} />
    </div>
  );
}

/**
 * The end of a form: what went wrong, then Cancel and the submit button on the right. Cancel
 * shows inside a dialog (it closes it) or wherever `onCancel` is given.
 */
export function SubmitRow({
  failure,
  submitting,
  label,
  busyLabel,
  onCancel,
}: {
  failure: string | null;
  submitting: boolean;
  label: string;
  busyLabel: string;
  onCancel?: () => void;
}) {
  return (
    <>
      <FormAlert message={failure} />
      <div className="flex flex-wrap justify-end gap-2">
        <DialogCancel onCancel={onCancel} />
        <button type="submit" className="btn-primary" disabled={submitting}>
          {submitting ? busyLabel : label}
        </button>
      </div>
    </>
  );
}

type ErrorBody = { error?: { message?: string; fields?: Record<string, string> } };

/**
 * Puts a 422's `error.fields` next to the matching form fields. Returns the message to
 * show above the form (the general message, plus any field the form does not have).
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  formFields: readonly string[],
): string {
  if (!(error instanceof ApiClientError))
    return error instanceof Error ? error.message : "The change could not be saved.";
  const fields = (error.body as ErrorBody | null)?.error?.fields ?? {};
  const leftover: string[] = [];
  let placed = false;
  for (const [key, message] of Object.entries(fields)) {
    const root = key.split(".")[0];
    if (formFields.includes(root)) {
      setError(root as Path<T>, { type: "server", message });
      placed = true;
    } else leftover.push(message);
  }
  // A taken name comes back as a 409 without fields; it belongs beside the name.
  if (
    error.status === 409 &&
    !placed &&
    leftover.length === 0 &&
    /already/i.test(error.message) &&
    formFields.includes("name")
  ) {
    setError("name" as Path<T>, { type: "server", message: error.message });
    placed = true;
  }
  // Said beside its field, a message is not said again at the foot of the form.
  return placed ? leftover.join(" ") : [error.message, ...leftover].join(" ");
}
