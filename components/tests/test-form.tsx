"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { applyServerErrors, Field, FieldError, SubmitRow } from "@/components/form-bits";
import { useCreateTest, useUpdateTest } from "@/hooks/use-writes";
import type { TestItem } from "@/lib/client/queries";
import { numberOrNull, numberRequired } from "@/lib/decimal";
import { type TestCreateInput, type TestUpdateInput, testCreateSchema } from "@/lib/validation/tests";

type FormInput = z.input<typeof testCreateSchema>;

const FIELDS = [
  "name",
  "unit",
  "decimals",
  "direction",
  "trialRule",
  "trialsPerSession",
  "swcMethod",
  "swcValue",
  "cvPercent",
  "typicalError",
  "typicalErrorDf",
  "typicalErrorSource",
  "plausibleMin",
  "plausibleMax",
  "aliases",
] as const;

const numberText = (value: number | null | undefined) => (value === null || value === undefined ? "" : String(value));

function defaultsFor(test: TestItem | null): Record<string, unknown> {
  if (!test) return { decimals: 2, trialRule: "best", trialsPerSession: 3, swcMethod: "sd-factor", swcValue: 0.2 };
  return {
    ...Object.fromEntries(FIELDS.map((f) => [f, test[f]])),
    decimals: numberText(test.decimals),
    trialsPerSession: numberText(test.trialsPerSession),
    swcValue: numberText(test.swcValue),
    cvPercent: numberText(test.cvPercent),
    typicalError: numberText(test.typicalError),
    typicalErrorDf: numberText(test.typicalErrorDf),
    plausibleMin: numberText(test.plausibleMin),
    plausibleMax: numberText(test.plausibleMax),
    typicalErrorSource: test.typicalErrorSource ?? "",
    aliases: test.aliases.join(", "),
  };
}

/** Create or edit a test of the Test library. Editing sends the version that was read. */
export function TestForm({ test, onDone }: { test: TestItem | null; onDone: (saved: { name: string }) => void }) {
  const [failure, setFailure] = useState<string | null>(null);
  const create = useCreateTest();
  const update = useUpdateTest();
  const {
    register,
    handleSubmit,
    watch,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormInput, unknown, TestCreateInput>({
    resolver: zodResolver(testCreateSchema),
    defaultValues: defaultsFor(test) as FormInput,
  });
  const method = watch("swcMethod");
  const unit = watch("unit")?.trim();
  const inUnit = unit ? ` (${unit})` : "";

  async function onSubmit(values: TestCreateInput) {
    setFailure(null);
    try {
      onDone(
        test
          ? await update.mutateAsync({
              testId: test.id,
              input: { ...values, version: test.version } satisfies TestUpdateInput,
            })
          : await create.mutateAsync(values),
      );
    } catch (error) {
      setFailure(applyServerErrors(error, setError, FIELDS));
    }
  }

  const err = (name: (typeof FIELDS)[number]) => errors[name]?.message as string | undefined;
  const field = (name: (typeof FIELDS)[number]) => ({
    id: `test-${name}`,
    "aria-invalid": err(name) ? true : undefined,
    "aria-describedby": err(name) ? `test-${name}-error` : undefined,
  });
  const num = { setValueAs: numberRequired };
  const optionalNum = { setValueAs: numberOrNull };

  return (
    <form onSubmit={handleSubmit(onSubmit, () => setFailure(null))} noValidate className="space-y-4">
      {test && (test.resultCount ?? 0) > 0 && (
        <p className="rounded-md bg-band px-3 py-2 text-sm">
          {test.resultCount} results already use this test. Changing its unit or direction changes how they read.
        </p>
      )}
      <div className="grid gap-4 sm:grid-cols-[2fr_1fr_1fr]">
        <Field id="test-name" label="Name" error={err("name")}>
          <input className="field" {...field("name")} {...register("name")} />
        </Field>
        <Field id="test-unit" label="Unit" error={err("unit")}>
          <input className="field" placeholder="cm, s, kg, m" {...field("unit")} {...register("unit")} />
        </Field>
        <Field id="test-decimals" label="Decimals" error={err("decimals")}>
          <input className="field num" inputMode="numeric" {...field("decimals")} {...register("decimals", num)} />
        </Field>
      </div>

      <Field id="test-aliases" label="Other names in files (optional)" error={err("aliases")}>
        <input
          className="field"
          placeholder="e.g. CMJ, Counter movement jump"
          aria-describedby={`test-aliases-help${err("aliases") ? " test-aliases-error" : ""}`}
          aria-invalid={err("aliases") ? true : undefined}
          id="test-aliases"
          {...register("aliases")}
        />
        <p id="test-aliases-help" className="mt-1 text-xs text-ink-soft">
          Separate them with commas. The Import reads a column or row named so as this test.
        </p>
      </Field>

      <fieldset>
        <legend className="label">Direction</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          <label className="flex items-center gap-2">
            <input type="radio" value="higher" {...register("direction")} /> ↑ Higher is better (jumps, distances,
            loads)
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" value="lower" {...register("direction")} /> ↓ Lower is better (sprint times)
          </label>
        </div>
        <FieldError message={err("direction")} />
      </fieldset>

      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="test-trialRule" label="Trial rule" error={err("trialRule")}>
          <select className="field" {...field("trialRule")} {...register("trialRule")}>
            <option value="best">Best of the trials</option>
            <option value="mean">Mean of the trials</option>
          </select>
        </Field>
        <Field id="test-trialsPerSession" label="Trials per session" error={err("trialsPerSession")}>
          <input
            className="field num"
            inputMode="numeric"
            {...field("trialsPerSession")}
            {...register("trialsPerSession", num)}
          />
        </Field>
      </div>

      <div className="grid gap-4 sm:grid-cols-[1.6fr_1fr_1fr]">
        <Field id="test-swcMethod" label="Smallest worthwhile change">
          <select className="field" {...field("swcMethod")} {...register("swcMethod")}>
            <option value="sd-factor">Factor × between-athlete SD</option>
            <option value="fixed">Fixed value in the unit</option>
            <option value="cv-factor">Factor × CV%</option>
          </select>
        </Field>
        <Field id="test-swcValue" label={method === "fixed" ? `SWC${inUnit}` : "Factor"} error={err("swcValue")}>
          <input className="field num" inputMode="decimal" {...field("swcValue")} {...register("swcValue", num)} />
        </Field>
        <Field id="test-cvPercent" label={`CV% ${method === "cv-factor" ? "" : "(optional)"}`} error={err("cvPercent")}>
          <input
            className="field num"
            inputMode="decimal"
            {...field("cvPercent")}
            {...register("cvPercent", optionalNum)}
          />
        </Field>
      </div>

      <div className="grid gap-4 sm:grid-cols-[1fr_1fr_2fr]">
        <Field id="test-typicalError" label={`Typical error${inUnit}`} error={err("typicalError")}>
          <input
            className="field num"
            inputMode="decimal"
            {...field("typicalError")}
            {...register("typicalError", optionalNum)}
          />
        </Field>
        <Field id="test-typicalErrorDf" label="Its df" error={err("typicalErrorDf")}>
          <input
            className="field num"
            inputMode="numeric"
            {...field("typicalErrorDf")}
            {...register("typicalErrorDf", optionalNum)}
          />
        </Field>
        <Field id="test-typicalErrorSource" label="Source of the typical error" error={err("typicalErrorSource")}>
          <input
            className="field"
            placeholder="e.g. club test–retest, August"
            {...field("typicalErrorSource")}
            {...register("typicalErrorSource")}
          />
        </Field>
      </div>

      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="test-plausibleMin" label={`Lowest plausible score${inUnit}`} error={err("plausibleMin")}>
          <input
            className="field num"
            inputMode="decimal"
            {...field("plausibleMin")}
            {...register("plausibleMin", optionalNum)}
          />
        </Field>
        <Field id="test-plausibleMax" label={`Highest plausible score${inUnit}`} error={err("plausibleMax")}>
          <input
            className="field num"
            inputMode="decimal"
            {...field("plausibleMax")}
            {...register("plausibleMax", optionalNum)}
          />
        </Field>
      </div>
      <p className="text-xs text-ink-faint">
        Scores outside the plausible range are still accepted on the Session sheet, but they are marked for a second
        look.
      </p>

      <SubmitRow
        failure={failure}
        submitting={isSubmitting}
        label={test ? "Save changes" : "Add test"}
        busyLabel="Saving…"
      />
    </form>
  );
}
